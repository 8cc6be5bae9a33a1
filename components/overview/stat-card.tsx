import Link from "next/link";

export function StatCard({ label, value, href, tone = "plain" }: { label: string; value: number; href?: string; tone?: "plain" | "alert" }) {
  const body = (
    <>
      <div className={`text-2xl font-bold ${tone === "alert" && value > 0 ? "text-coral-700" : ""}`}>{value}</div>
      <div className="text-xs text-abyss-500">{label}</div>
    </>
  );
  const cls = "block rounded-lg border border-rule bg-panel p-3";
  return href ? <Link href={href} className={`${cls} hover:border-tide-600`}>{body}</Link> : <div className={cls}>{body}</div>;
}
