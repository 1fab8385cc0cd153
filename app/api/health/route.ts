import { NextResponse } from "next/server";
import { db } from "@/lib/db";

/** Liveness and database reachability, for the start script and monitors. */
export async function GET() {
  try {
    await db().sequelize.query("SELECT 1");
    return NextResponse.json({ status: "ok" });
  } catch {
    return NextResponse.json({ status: "degraded", database: "unreachable" }, { status: 503 });
  }
}
