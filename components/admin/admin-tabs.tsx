import Link from "next/link";

export function AdminTabs({ current }: { current: "users" | "outbox" }) {
  const tab = (key: "users" | "outbox", label: string) => (
    <Link href={`/admin/${key}`} aria-current={current === key ? "page" : undefined} className={`rounded-md px-3 py-1.5 text-sm font-semibold ${current === key ? "bg-abyss-900 text-white" : "text-abyss-700 hover:bg-panel"}`}>
      {label}
    </Link>
  );
  return <div className="mb-4 flex gap-2">{tab("users", "Users")}{tab("outbox", "Outbox")}</div>;
}
