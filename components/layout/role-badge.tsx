import type { Role } from "@/db/schema";

const TONE: Record<Role, string> = {
  admin: "border-ink/30 text-ink",
  manager: "border-accent-600/40 text-accent-700",
  engineer: "border-line text-ink-soft",
  viewer: "border-line text-ink-soft",
};

export function RoleBadge({ role }: { role: Role }) {
  return <span className={`badge ${TONE[role]}`} data-testid="role-badge">{role}</span>;
}
