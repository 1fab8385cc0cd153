"use client";

import { useActionState } from "react";
import { acceptInvitationAction } from "@/lib/actions/accept-invitation";
import { idle } from "@/lib/action-state";
import { SubmitButton } from "@/components/ui/submit-button";
import { FormMessage } from "@/components/ui/form-message";

export function AcceptInvitationForm({ token, workspaceName }: { token: string; workspaceName: string }) {
  const [state, action] = useActionState(acceptInvitationAction, idle);
  return (
    <form action={action} className="space-y-4">
      <FormMessage state={state} />
      <input type="hidden" name="token" value={token} />
      <SubmitButton pendingLabel="Joining…">Join {workspaceName}</SubmitButton>
    </form>
  );
}
