/** Roles a member holds in one workspace. Shared by server and client code. */
export const ROLES = ["owner", "technician", "builder", "instructor", "student"] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  owner: "Owner",
  technician: "Technician",
  builder: "Builder",
  instructor: "Instructor",
  student: "Student",
};

export const ROLE_SUMMARIES: Record<Role, string> = {
  owner: "Everything, including members, invitations and workspace settings.",
  technician: "Vehicles, sensors and calibration runs; signs off calibrations.",
  builder: "Vehicles and the runs they upload; cannot sign off.",
  instructor: "Class sessions and teaching scenarios; reads runs.",
  student: "Reads what the workspace shares with students; joins class sessions.",
};

export const WORKSPACE_KINDS = ["operator", "repair-shop", "school", "builder", "other"] as const;
export type WorkspaceKind = (typeof WORKSPACE_KINDS)[number];

export const WORKSPACE_KIND_LABELS: Record<WorkspaceKind, string> = {
  operator: "Operator fleet",
  "repair-shop": "Repair shop",
  school: "Club or training school",
  builder: "Builder's bench",
  other: "Other",
};
