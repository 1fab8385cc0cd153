"use client";

import { mountingRotationById } from "@/geometry/mounting-rotations";
import type { Vec3 } from "@/geometry/types";

/**
 * A module's axes against the vehicle's, seen from above: the vehicle's nose points up the
 * page (body x forward), its right side to the right (body y). The module is a square with
 * its axes where its mounting puts them; the one axis that is vertical in every one of the 48
 * mountings is drawn at the centre, ⊗ pointing down into the page, ⊙ up out of it.
 */

const CENTRE = { x: 124, y: 92 };
const ARROW = 40;
const HALF_SIDE = 15;
const AXIS_NAMES = ["x", "y", "z"] as const;
const WORD: Record<string, string> = { "1,0": "forward", "-1,0": "back", "0,1": "right", "0,-1": "left" };

/** Body-frame direction → page offset: forward is up the page, right is to the right. */
const toPage = (v: Vec3, length: number) => ({ x: v[1] * length, y: -v[0] * length });

/** Where a body direction points, in words ("forward-right", "down"). */
function directionWord(v: Vec3): string {
  if (Math.abs(v[2]) > 0.9) return v[2] > 0 ? "down" : "up";
  const along = WORD[`${Math.sign(Math.round(v[0] * 2))},0`];
  const across = WORD[`0,${Math.sign(Math.round(v[1] * 2))}`];
  return [along, across].filter(Boolean).join("-");
}

const round = (v: number) => Math.round(v * 10) / 10;

function Arrow({ from, dx, dy }: { from: { x: number; y: number }; dx: number; dy: number }) {
  const length = Math.hypot(dx, dy);
  const ux = dx / length;
  const uy = dy / length;
  const tip = { x: from.x + dx, y: from.y + dy };
  const head = `${round(tip.x)},${round(tip.y)} ${round(tip.x - 7 * ux - 3.5 * uy)},${round(tip.y - 7 * uy + 3.5 * ux)} ${round(tip.x - 7 * ux + 3.5 * uy)},${round(tip.y - 7 * uy - 3.5 * ux)}`;
  return (
    <g>
      <line x1={round(from.x)} y1={round(from.y)} x2={round(tip.x)} y2={round(tip.y)} stroke="currentColor" strokeWidth="2" />
      <polygon points={head} fill="currentColor" />
    </g>
  );
}

export function MountingPicture({ mountingId, className = "" }: { mountingId: string; className?: string }) {
  const mounting = mountingRotationById(mountingId);
  if (!mounting) return null;
  const axes = AXIS_NAMES.map((name, i) => {
    const v: Vec3 = [mounting.matrix[0][i], mounting.matrix[1][i], mounting.matrix[2][i]];
    return { name, v, word: directionWord(v), vertical: Math.abs(v[2]) > 0.9 };
  });
  const level = axes.filter((a) => !a.vertical);
  const upright = axes.find((a) => a.vertical)!;
  // The square's corners lie along the two level axes; the vertical axis's label sits opposite them.
  const [a, b] = level.map((axis) => toPage(axis.v, HALF_SIDE));
  const corners = [
    [a.x + b.x, a.y + b.y],
    [a.x - b.x, a.y - b.y],
    [-a.x - b.x, -a.y - b.y],
    [-a.x + b.x, -a.y + b.y],
  ]
    .map(([x, y]) => `${round(CENTRE.x + x)},${round(CENTRE.y + y)}`)
    .join(" ");
  const away = { x: -(a.x + b.x), y: -(a.y + b.y) };
  const awayLength = Math.hypot(away.x, away.y);
  const ux = away.x / awayLength;
  const uy = away.y / awayLength;
  // Beyond the square's corner, reading away from it.
  const uprightLabel = {
    x: CENTRE.x + ux * 24,
    y: CENTRE.y + uy * 24 + (uy > 0.3 ? 10 : uy < -0.3 ? -2 : 4),
    anchor: (ux > 0.3 ? "start" : ux < -0.3 ? "end" : "middle") as "start" | "end" | "middle",
  };

  return (
    <svg
      viewBox="0 0 200 170"
      className={`h-40 w-48 shrink-0 ${className}`}
      role="img"
      aria-label={`Seen from above, nose up the page: ${mounting.words}`}
      data-testid="mounting-picture"
      data-mounting={mounting.id}
      fontSize="11"
    >
      {/* The vehicle, nose up the page. */}
      <path
        d="M124 8 C150 26 158 48 158 70 L158 160 L90 160 L90 70 C90 48 98 26 124 8 Z"
        className="fill-chart-sheet stroke-chart-rule"
        strokeWidth="1.5"
      />
      <g data-axis="vehicle-x" data-points="forward" className="text-chart-muted">
        <Arrow from={{ x: 26, y: 146 }} dx={0} dy={-40} />
        <text x="26" y="100" textAnchor="middle" fill="currentColor">
          forward
        </text>
      </g>
      <g data-axis="vehicle-y" data-points="right" className="text-chart-muted">
        <Arrow from={{ x: 26, y: 146 }} dx={40} dy={0} />
        <text x="70" y="150" fill="currentColor">
          right
        </text>
      </g>
      <text x="8" y="18" className="fill-chart-muted" fontSize="10">
        vehicle, from above
      </text>

      {/* The module. */}
      <polygon points={corners} className="fill-lox-100 stroke-lox-600 dark:fill-lox-900 dark:stroke-lox-300" strokeWidth="1.5" />
      {level.map((axis) => {
        const end = toPage(axis.v, ARROW);
        const label = toPage(axis.v, ARROW + 11);
        return (
          <g key={axis.name} data-axis={`module-${axis.name}`} data-points={axis.word} className="text-brass-700 dark:text-brass-300">
            <Arrow from={CENTRE} dx={end.x} dy={end.y} />
            <text x={round(CENTRE.x + label.x)} y={round(CENTRE.y + label.y + 4)} textAnchor="middle" fill="currentColor" fontWeight="600">
              {axis.name}
            </text>
          </g>
        );
      })}
      <g data-axis={`module-${upright.name}`} data-points={upright.word} className="text-brass-700 dark:text-brass-300">
        <circle cx={CENTRE.x} cy={CENTRE.y} r="6" className="fill-chart-sheet" stroke="currentColor" strokeWidth="1.5" />
        {upright.word === "down" ? (
          <path
            d={`M${CENTRE.x - 4} ${CENTRE.y - 4} L${CENTRE.x + 4} ${CENTRE.y + 4} M${CENTRE.x + 4} ${CENTRE.y - 4} L${CENTRE.x - 4} ${CENTRE.y + 4}`}
            stroke="currentColor"
            strokeWidth="1.5"
          />
        ) : (
          <circle cx={CENTRE.x} cy={CENTRE.y} r="1.8" fill="currentColor" />
        )}
        <text x={round(uprightLabel.x)} y={round(uprightLabel.y)} textAnchor={uprightLabel.anchor} fill="currentColor" fontWeight="600">
          {`${upright.name} ${upright.word}`}
        </text>
      </g>
    </svg>
  );
}
