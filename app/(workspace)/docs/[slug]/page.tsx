import { notFound } from "next/navigation";
import { requirePageUser } from "@/lib/auth/page";
import { renderDoc } from "@/lib/docs";

export const dynamic = "force-dynamic";

export default async function DocPage({ params }: { params: Promise<{ slug: string }> }) {
  await requirePageUser();
  const doc = await renderDoc((await params).slug);
  if (!doc) notFound();
  return <article className="doc max-w-3xl" dangerouslySetInnerHTML={{ __html: doc.html }} />;
}
