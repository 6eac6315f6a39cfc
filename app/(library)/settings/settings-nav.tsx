import Link from "next/link";

export function SettingsNav({ at }: { at: "profile" | "tokens" }) {
  const item = (key: typeof at, href: string, label: string) => (
    <Link href={href} aria-current={at === key ? "page" : undefined}
      className={`border-b-2 px-1 pb-1 ${at === key ? "border-copper text-ink" : "border-transparent text-graphite hover:text-copper-dark"}`}>{label}</Link>
  );
  return (
    <nav aria-label="Settings" className="flex gap-4 border-b border-rule text-sm">
      {item("profile", "/settings", "Profile")}
      {item("tokens", "/settings/tokens", "API tokens")}
    </nav>
  );
}
