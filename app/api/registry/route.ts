import { NextResponse } from "next/server";
import { withRole } from "@/lib/auth/api";
import { listRegistry, parseRegistryQuery } from "@/lib/registry";

/** The registry table: filters, sort and page from the query string; visibility by role (lib/registry). */
export const GET = withRole("viewer", async (req, _ctx, user) => {
  const query = parseRegistryQuery(req.nextUrl.searchParams);
  const page = await listRegistry(user, query);
  return NextResponse.json({ ...page, query });
});
