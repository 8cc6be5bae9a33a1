import { redirect } from "next/navigation";
import { getPageUser } from "@/lib/auth/page";

export const dynamic = "force-dynamic";

export default async function Home() {
  redirect((await getPageUser()) ? "/overview" : "/signin");
}
