/**
 * A QR code as one SVG path (the `qrcode` package makes the symbol; we draw it), so the join
 * code can be scanned from a projector without an image file or inner HTML.
 */
import { create } from "qrcode";

export interface QrSymbol {
  /** Modules per side, without the quiet zone. */
  size: number;
  /** Dark modules, merged into horizontal runs, in module units. */
  path: string;
}

/** Quiet zone around the symbol, in modules (ISO/IEC 18004 asks for four). */
export const QR_QUIET_ZONE = 4;

/** The symbol for `text`, with medium error correction (a smudged screen still scans). */
export function qrSymbol(text: string): QrSymbol {
  const { modules } = create(text, { errorCorrectionLevel: "M" });
  const { size } = modules;
  let path = "";
  for (let row = 0; row < size; row++) {
    let col = 0;
    while (col < size) {
      if (!modules.get(row, col)) {
        col += 1;
        continue;
      }
      const start = col;
      while (col < size && modules.get(row, col)) col += 1;
      path += `M${start} ${row}h${col - start}v1h${start - col}z`;
    }
  }
  return { size, path };
}
