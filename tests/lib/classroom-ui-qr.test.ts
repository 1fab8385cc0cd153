import { describe, expect, test } from "vitest";
import { qrSymbol } from "@/components/classroom/qr-symbol";

/** The path's dark modules back as a set of "row,col". */
function darkModules(path: string): Set<string> {
  const dark = new Set<string>();
  for (const [, col, row, run] of path.matchAll(/M(\d+) (\d+)h(\d+)v1h-\d+z/g)) {
    for (let c = Number(col); c < Number(col) + Number(run); c++) dark.add(`${row},${c}`);
  }
  return dark;
}

describe("qrSymbol", () => {
  const url = "http://127.0.0.1:3000/join?code=K7QX4M";
  const symbol = qrSymbol(url);
  const dark = darkModules(symbol.path);

  test("a symbol size of a real QR version: 17 + 4·version modules (ISO/IEC 18004)", () => {
    expect((symbol.size - 17) % 4).toBe(0);
    expect(symbol.size).toBeGreaterThanOrEqual(21);
  });

  test("the three finder patterns are drawn: a dark 7×7 ring with a dark 3×3 centre (ISO/IEC 18004)", () => {
    const n = symbol.size;
    for (const [top, left] of [
      [0, 0],
      [0, n - 7],
      [n - 7, 0],
    ]) {
      for (let r = 0; r < 7; r++) {
        for (let c = 0; c < 7; c++) {
          const ring = r === 0 || r === 6 || c === 0 || c === 6;
          const centre = r >= 2 && r <= 4 && c >= 2 && c <= 4;
          expect(dark.has(`${top + r},${left + c}`), `module ${top + r},${left + c}`).toBe(ring || centre);
        }
      }
    }
  });

  test("the same text gives the same symbol; another code another one", () => {
    expect(qrSymbol(url).path).toBe(symbol.path);
    expect(qrSymbol(url.replace("K7QX4M", "K7QX4N")).path).not.toBe(symbol.path);
  });

  test("every path piece stays inside the symbol", () => {
    for (const cell of dark) {
      const [r, c] = cell.split(",").map(Number);
      expect(r).toBeLessThan(symbol.size);
      expect(c).toBeLessThan(symbol.size);
    }
  });
});
