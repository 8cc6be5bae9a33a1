import { NextResponse } from "next/server";
import { withRole, jsonError, readJson } from "@/lib/auth/api";
import { designModel } from "@/lib/screening/design";
import { allow } from "@/lib/rate-limit";

/** Designs are CPU work (a screen each); a person clicks a few times a minute. */
export const DESIGNS_PER_MINUTE = 60;

/**
 * Design mode: { class, solve, set: { name: expr }, window, parameters?, constants? } → the
 * design result (solution, constants, screening verdicts, plot data, YAML), or 422 with errors.
 */
export const POST = withRole("researcher", async (req, _ctx, user) => {
  if (!allow(`design:${user.id}`, DESIGNS_PER_MINUTE, 60_000)) return jsonError(429, "too many design requests; wait a minute");
  const body = await readJson(req);
  if (!body) return jsonError(400, "send a JSON object { class, solve, set, window, parameters?, constants? } (at most 64 KB)");
  const out = await designModel(body, { signal: req.signal });
  if (!out.ok) return jsonError(422, out.errors[0].message, { errors: out.errors });
  return NextResponse.json({ result: out.result });
});
