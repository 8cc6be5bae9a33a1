import { NextResponse } from "next/server";
import { withRole } from "@/lib/auth/api";
import { listOutbox } from "@/lib/mail/outbox";

export const GET = withRole("admin", async () => NextResponse.json({ messages: await listOutbox(100) }));
