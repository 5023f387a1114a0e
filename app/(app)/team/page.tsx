import { MembersPanel } from "@/components/team/members-panel";
import { requirePageActor } from "@/lib/auth/session";
import { can } from "@/lib/authz/policy";

export const metadata = { title: "Members" };

const ROLE_NOTES = [
  ["admin", "members and invitations"],
  ["manager", "sees every project, compares and approves designs"],
  ["engineer", "creates projects, kinetics and sweeps; pins designs"],
  ["viewer", "reads projects and approved designs only"],
];

export default async function TeamPage() {
  const actor = await requirePageActor();
  if (!can(actor, "member.list")) {
    return (
      <div className="card p-6">
        <h1>Members</h1>
        <p className="mt-2 text-ink-soft">Only the team&apos;s admins manage members and invitations.</p>
      </div>
    );
  }
  return (
    <div className="space-y-4">
      <div>
        <h1>Members of {actor.teamName}</h1>
        <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-sm">
          {ROLE_NOTES.map(([role, note]) => (
            <div key={role} className="contents">
              <dt className="font-medium">{role}</dt>
              <dd className="text-ink-soft">{note}</dd>
            </div>
          ))}
        </dl>
      </div>
      <MembersPanel selfId={actor.userId} />
    </div>
  );
}
