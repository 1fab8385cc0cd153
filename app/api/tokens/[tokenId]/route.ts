import { NextResponse } from "next/server";
import { jsonError, userRoute } from "@/lib/api";
import { revokeApiToken } from "@/lib/data/api-tokens";

export const DELETE = userRoute<{ tokenId: string }>(async (_request, viewer, { tokenId }) => {
  if (!/^[0-9a-f-]{36}$/i.test(tokenId) || !(await revokeApiToken(viewer.id, tokenId))) return jsonError(404, "not-found", "Not found.");
  return NextResponse.json({ revoked: true });
});
