import { NextResponse } from "next/server";
import { withAnyone } from "@/lib/auth/api";
import { sequelize } from "@/models";
import { ENGINE_VERSION } from "@/lib/screening/version";

export const GET = withAnyone(async () => {
  await sequelize.query("SELECT 1");
  return NextResponse.json({ ok: true, engine: ENGINE_VERSION });
});
