import { NextResponse } from "next/server";
import { z } from "zod";
import { readJson, userRoute } from "@/lib/api";
import { createApiToken, listApiTokens } from "@/lib/data/api-tokens";

export const GET = userRoute(async (_request, viewer) => NextResponse.json({ tokens: await listApiTokens(viewer.id) }));

/** Create a personal API token; the secret is in this answer only. */
export const POST = userRoute(async (request, viewer) => {
  const body = await readJson(request, z.object({ name: z.string().trim().min(1, "Name the token.").max(80) }));
  if (!body.ok) return body.response;
  const { token, summary } = await createApiToken(viewer.id, body.data.name);
  return NextResponse.json({ token, summary }, { status: 201 });
});
