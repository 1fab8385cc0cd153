/**
 * Colours of the 3D view, light and dark, taken from the Tailwind palette (tailwind.config.ts)
 * so the sphere, the flat map and the legend agree: cells in the lox teal, empty cells in the
 * "heed" amber, compass points darker (light theme) or paler (dark theme) than the cells so
 * they stand out over them.
 */
export interface ScenePalette {
  ink: string;
  /** The halo behind label text. */
  paper: string;
  muted: string;
  cell: string;
  empty: string;
  /** Point colours per compass, in order. */
  compasses: string[];
}

export const SCENE_PALETTES: Record<"light" | "dark", ScenePalette> = {
  light: {
    ink: "#14202b",
    paper: "#ffffff",
    muted: "#5a6670",
    cell: "#327e7a", // lox-500
    empty: "#b26a00", // heed
    compasses: ["#163d43", "#a36221", "#5a6670"], // lox-800, brass-600, chart-muted
  },
  dark: {
    ink: "#e8ecea",
    paper: "#142026",
    muted: "#9aa8ac",
    cell: "#4e9a95", // lox-400
    empty: "#fbbf24", // amber-400
    compasses: ["#d5ebe8", "#dfb26c", "#9aa8ac"], // lox-100, brass-300, chart-muted
  },
};
