import type { Role, WorkspaceKind } from "@/lib/roles";

/**
 * The demo world: an invented survey operator and an invented flying school. No real
 * people, companies or places; e-mail addresses use the reserved `.example` domain.
 */
export interface DemoPerson {
  name: string;
  email: string;
  password: string;
  memberships: { workspace: string; role: Role }[];
}

export const DEMO_WORKSPACES: { slug: string; name: string; kind: WorkspaceKind }[] = [
  { slug: "quillmere-survey", name: "Quillmere Survey Cooperative", kind: "operator" },
  { slug: "brackenfold-school", name: "Brackenfold Flying School", kind: "school" },
];

export const DEMO_PEOPLE: DemoPerson[] = [
  {
    name: "Odile Marchetti",
    email: "odile@quillmere.example",
    password: "lox-owner-2026",
    memberships: [{ workspace: "quillmere-survey", role: "owner" }],
  },
  {
    name: "Tomasz Whitlock",
    email: "tomasz@quillmere.example",
    password: "lox-tech-2026",
    memberships: [{ workspace: "quillmere-survey", role: "technician" }],
  },
  {
    name: "Aiyana Corrow",
    email: "aiyana@quillmere.example",
    password: "lox-tech2-2026",
    memberships: [{ workspace: "quillmere-survey", role: "technician" }],
  },
  {
    name: "Priya Lindqvist",
    email: "priya@quillmere.example",
    password: "lox-build-2026",
    memberships: [{ workspace: "quillmere-survey", role: "builder" }],
  },
  {
    name: "Hamish Oduya",
    email: "hamish@brackenfold.example",
    password: "lox-teach-2026",
    memberships: [
      { workspace: "brackenfold-school", role: "owner" },
      { workspace: "quillmere-survey", role: "instructor" },
    ],
  },
  {
    name: "Rosa Feldkamp",
    email: "rosa@brackenfold.example",
    password: "lox-teach2-2026",
    memberships: [{ workspace: "brackenfold-school", role: "instructor" }],
  },
  {
    name: "Jun Arkwright",
    email: "jun@brackenfold.example",
    password: "lox-student-2026",
    memberships: [
      { workspace: "brackenfold-school", role: "student" },
      { workspace: "quillmere-survey", role: "student" },
    ],
  },
  {
    name: "Mele Tavita",
    email: "mele@brackenfold.example",
    password: "lox-student2-2026",
    memberships: [{ workspace: "brackenfold-school", role: "student" }],
  },
];
