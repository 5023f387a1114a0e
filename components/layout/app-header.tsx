"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import type { Role } from "@/db/schema";
import { signOutNow } from "@/components/auth/auth-client";
import { fetchJson } from "@/lib/client/fetch-json";
import { Brand } from "./brand";
import { RoleBadge } from "./role-badge";
import { useHydrated } from "@/components/ui/use-hydrated";
import { ReviewCount } from "@/components/reviews/review-count";

export interface HeaderProps {
  userName: string;
  userEmail: string;
  teamId: string;
  teamName: string;
  role: Role;
  teams: { teamId: string; teamName: string; role: Role }[];
}

export function AppHeader({ userName, userEmail, teamId, teamName, role, teams }: HeaderProps) {
  const pathname = usePathname();
  const hydrated = useHydrated();
  const nav = [{ href: "/", label: "Projects" }, { href: "/inventory", label: "Inventory" }, ...(role === "admin" ? [{ href: "/team", label: "Members" }] : [])];

  async function switchTeam(next: string) {
    await fetchJson("/api/me/team", { method: "POST", json: { teamId: next } });
    // Full reload: every server-rendered page and cached query belongs to the old team.
    // eslint-disable-next-line @next/next/no-location-assign-relative-destination
    window.location.assign("/");
  }

  return (
    <header className="border-b border-line bg-white">
      <div className="mx-auto flex h-12 max-w-6xl items-center gap-6 px-4">
        <Link href="/" aria-label="Seriatim home">
          <Brand />
        </Link>
        <nav className="flex gap-4 text-sm">
          {nav.map((n) => {
            const active = n.href === "/" ? pathname === "/" || pathname.startsWith("/projects") : pathname.startsWith(n.href);
            return (
              <Link key={n.href} href={n.href} className={active ? "font-medium text-accent-700" : "text-ink-soft hover:text-ink"}>
                {n.label}
              </Link>
            );
          })}
          {role === "manager" || role === "admin" ? <ReviewCount active={pathname.startsWith("/reviews")} /> : null}
        </nav>
        <div className="ml-auto flex items-center gap-3 text-sm">
          {teams.length > 1 ? (
            <select aria-label="Team" className="input w-auto py-1" value={teamId} onChange={(e) => void switchTeam(e.target.value)}>
              {teams.map((t) => (
                <option key={t.teamId} value={t.teamId}>
                  {t.teamName}
                </option>
              ))}
            </select>
          ) : (
            <span className="text-ink-soft" data-testid="team-name">{teamName}</span>
          )}
          <RoleBadge role={role} />
          <Link href="/settings" className="text-ink hover:underline" title={`${userEmail}: your settings, including the units results are shown in`} data-testid="user-name">
            {userName}
          </Link>
          <button type="button" className="btn-quiet py-1" onClick={() => void signOutNow()} disabled={!hydrated}>
            Sign out
          </button>
        </div>
      </div>
    </header>
  );
}
