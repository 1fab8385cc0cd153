"use client";

import { useActionState } from "react";
import { changeMemberRoleAction } from "@/lib/actions/change-member-role";
import { removeMemberAction } from "@/lib/actions/remove-member";
import { revokeInvitationAction } from "@/lib/actions/revoke-invitation";
import { idle } from "@/lib/action-state";
import { ROLES, ROLE_LABELS, type Role } from "@/lib/roles";

export function RoleSelect({ workspace, membershipId, role, name }: { workspace: string; membershipId: string; role: Role; name: string }) {
  const [state, action, pending] = useActionState(changeMemberRoleAction, idle);
  return (
    <form action={action} className="flex items-center gap-2">
      <input type="hidden" name="workspace" value={workspace} />
      <input type="hidden" name="membershipId" value={membershipId} />
      <select
        name="role"
        defaultValue={role}
        aria-label={`Role of ${name}`}
        className="field-input w-auto py-1"
        disabled={pending}
        onChange={(event) => event.currentTarget.form?.requestSubmit()}
      >
        {ROLES.map((r) => (
          <option key={r} value={r}>
            {ROLE_LABELS[r]}
          </option>
        ))}
      </select>
      {state.status === "error" ? (
        <span role="alert" className="text-xs text-halt">
          {state.message === "Some fields need attention." ? Object.values(state.fieldErrors ?? {})[0] : state.message}
        </span>
      ) : null}
    </form>
  );
}

export function RemoveMemberButton({ workspace, membershipId, name }: { workspace: string; membershipId: string; name: string }) {
  const [state, action, pending] = useActionState(removeMemberAction, idle);
  return (
    <form
      action={action}
      onSubmit={(event) => {
        if (!window.confirm(`Remove ${name} from this workspace?`)) event.preventDefault();
      }}
    >
      <input type="hidden" name="workspace" value={workspace} />
      <input type="hidden" name="membershipId" value={membershipId} />
      <button type="submit" className="text-xs font-semibold text-halt hover:underline" disabled={pending}>
        Remove
      </button>
      {state.status === "error" ? (
        <span role="alert" className="ml-2 text-xs text-halt">
          {state.message}
        </span>
      ) : null}
    </form>
  );
}

export function RevokeInvitationButton({ workspace, invitationId }: { workspace: string; invitationId: string }) {
  const [state, action, pending] = useActionState(revokeInvitationAction, idle);
  return (
    <form action={action}>
      <input type="hidden" name="workspace" value={workspace} />
      <input type="hidden" name="invitationId" value={invitationId} />
      <button type="submit" className="text-xs font-semibold text-halt hover:underline" disabled={pending}>
        Withdraw
      </button>
      {state.status === "error" ? (
        <span role="alert" className="ml-2 text-xs text-halt">
          {state.message}
        </span>
      ) : null}
    </form>
  );
}
