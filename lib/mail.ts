import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import { appUrl, smtp } from "@/lib/env";

let transporter: Transporter | undefined;

function transport(): Transporter {
  transporter ??= nodemailer.createTransport({
    host: smtp.host,
    port: smtp.port,
    secure: smtp.secure,
    auth: smtp.user ? { user: smtp.user, pass: smtp.password } : undefined,
    // The local sink speaks plain SMTP; a real relay negotiates STARTTLS when it offers it.
    ignoreTLS: !smtp.user && smtp.host === "127.0.0.1",
  });
  return transporter;
}

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
}

export async function sendMail(mail: OutgoingMail): Promise<void> {
  await transport().sendMail({ from: smtp.from, ...mail });
}

function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

function layout(heading: string, paragraphs: string[], link: { href: string; label: string }): { text: string; html: string } {
  const text = [heading, "", ...paragraphs, "", `${link.label}: ${link.href}`, "", "— Loxodrome"].join("\n");
  const html = `<div style="font-family:system-ui,sans-serif;max-width:560px;color:#14202b">
<h2 style="color:#1d5c63">${escapeHtml(heading)}</h2>
${paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`).join("\n")}
<p><a href="${escapeHtml(link.href)}" style="background:#1d5c63;color:#fff;padding:10px 16px;border-radius:8px;text-decoration:none">${escapeHtml(link.label)}</a></p>
<p style="color:#5a6670;font-size:13px">Or paste this address into your browser: ${escapeHtml(link.href)}</p>
</div>`;
  return { text, html };
}

export async function sendInvitationMail(input: {
  to: string;
  inviterName: string;
  workspaceName: string;
  roleLabel: string;
  token: string;
  expiresAt: Date;
}): Promise<void> {
  const href = `${appUrl}/invitations/${input.token}`;
  const body = layout(
    `${input.inviterName} invited you to ${input.workspaceName}`,
    [
      `You have been invited to join the ${input.workspaceName} workspace on Loxodrome as ${input.roleLabel}.`,
      `The invitation is valid until ${input.expiresAt.toUTCString()}.`,
    ],
    { href, label: "Open the invitation" },
  );
  await sendMail({ to: input.to, subject: `Join ${input.workspaceName} on Loxodrome`, ...body });
}

export async function sendPasswordResetMail(input: { to: string; name: string; token: string; expiresAt: Date }): Promise<void> {
  const href = `${appUrl}/reset-password/${input.token}`;
  const body = layout(
    "Choose a new password",
    [
      `Hello ${input.name}, someone (probably you) asked to reset the password of this Loxodrome account.`,
      `The link works once, until ${input.expiresAt.toUTCString()}. If you did not ask for it, ignore this message: your password stays as it is.`,
    ],
    { href, label: "Choose a new password" },
  );
  await sendMail({ to: input.to, subject: "Reset your Loxodrome password", ...body });
}
