"use client";

import { useFormStatus } from "react-dom";
import type { ReactNode } from "react";

export function SubmitButton({
  children,
  pendingLabel,
  variant = "primary",
  className = "",
}: {
  children: ReactNode;
  pendingLabel?: string;
  variant?: "primary" | "quiet" | "danger";
  className?: string;
}) {
  const { pending } = useFormStatus();
  const style = variant === "primary" ? "btn-primary" : variant === "danger" ? "btn-danger" : "btn-quiet";
  return (
    <button type="submit" className={`${style} ${className}`} disabled={pending} aria-busy={pending}>
      {pending ? (pendingLabel ?? "Working…") : children}
    </button>
  );
}
