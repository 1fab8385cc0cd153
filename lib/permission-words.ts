import type { Action } from "@/lib/permissions";

/** Each permission in a technician's words, for people rather than code. */
export const ACTION_WORDS: Record<Action, string> = {
  "workspace.view": "see the workspace",
  "workspace.update": "change its settings",
  "member.list": "see who is in it",
  "member.invite": "invite people",
  "member.change-role": "change roles",
  "member.remove": "remove people",
  "audit.view": "read the logbook",
  "vehicle.view": "see the fleet",
  "vehicle.edit": "add and edit vehicles and sensors",
  "site.edit": "add and edit sites",
  "run.view": "open calibration runs",
  "run.create": "upload runs",
  "run.edit": "process runs again",
  "run.sign-off": "sign off calibrations",
  "class.view": "see class sessions",
  "class.host": "host class sessions",
  "class.join": "join class sessions",
  "scenario.manage": "compose teaching scenarios",
  "demo.manage": "manage demo data",
  "shared.view": "read what is shared with students",
};
