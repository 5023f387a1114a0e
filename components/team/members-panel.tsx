"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import type { Role } from "@/db/schema";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { Field, FormMessage } from "@/components/ui/field";
import { OptionList } from "@/components/ui/unit-options";
import { messageAfterRefusal, useSchemaForm } from "@/components/ui/use-schema-form";
import { ROLES } from "@/lib/authz/policy";
import { ApiError, fetchJson } from "@/lib/client/fetch-json";
import { invitationCreateSchema } from "@/lib/schemas/accounts";
import { formatDay } from "@/lib/format/dates";
import type { MemberView, OpenInvitationView } from "@/lib/services/views";

const ROLE_OPTIONS = ROLES.map((r) => ({ value: r, label: r }));

type Member = MemberView;
type Invitation = OpenInvitationView;

const message = (err: unknown) => (err instanceof ApiError ? err.message : "Could not reach the server.");

export function MembersPanel({ selfId }: { selfId: string }) {
  const qc = useQueryClient();
  const members = useQuery({ queryKey: ["members"], queryFn: () => fetchJson<{ members: Member[] }>("/api/team/members").then((r) => r.members) });
  const invitations = useQuery({
    queryKey: ["invitations"],
    queryFn: () => fetchJson<{ invitations: Invitation[] }>("/api/team/invitations").then((r) => r.invitations),
  });
  const [error, setError] = useState<string>();
  // What waits for confirmation: a role change (the select shows the old role until confirmed) or a revocation.
  const [pendingRole, setPendingRole] = useState<{ userId: string; email: string; from: Role; role: Role }>();
  const [pendingRevoke, setPendingRevoke] = useState<Invitation>();
  const refresh = () => Promise.all([qc.invalidateQueries({ queryKey: ["members"] }), qc.invalidateQueries({ queryKey: ["invitations"] })]);

  const changeRole = useMutation({
    mutationFn: ({ userId, role }: { userId: string; role: Role }) => fetchJson(`/api/team/members/${userId}`, { method: "PATCH", json: { role } }),
    onSuccess: () => (setError(undefined), setPendingRole(undefined), refresh()),
    onError: (e) => (setPendingRole(undefined), setError(message(e))),
  });
  const revoke = useMutation({
    mutationFn: (id: string) => fetchJson(`/api/team/invitations/${id}`, { method: "DELETE" }),
    onSuccess: () => (setError(undefined), setPendingRevoke(undefined), refresh()),
    onError: (e) => (setPendingRevoke(undefined), setError(message(e))),
  });

  return (
    <div className="space-y-5">
      {error ? <FormMessage kind="error">{error}</FormMessage> : null}
      <section className="card overflow-hidden">
        <h2 className="border-b border-line px-3 py-2">Members</h2>
        <table className="table-dense" data-testid="members-table">
          <thead>
            <tr>
              <th>Name</th>
              <th>E-mail</th>
              <th>Joined</th>
              <th className="w-40">Role</th>
            </tr>
          </thead>
          <tbody>
            {(members.data ?? []).map((m) => (
              <tr key={m.userId}>
                <td>{m.name}</td>
                <td className="text-ink-soft">{m.email}</td>
                <td className="tabular-nums">{formatDay(m.joinedAt)}</td>
                <td>
                  <select
                    aria-label={`Role of ${m.email}`}
                    className="input py-1"
                    value={m.role}
                    disabled={changeRole.isPending || m.userId === selfId}
                    onChange={(e) => setPendingRole({ userId: m.userId, email: m.email, from: m.role, role: e.target.value as Role })}
                  >
                    <OptionList options={ROLE_OPTIONS} />
                  </select>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>
      <InviteForm onInvited={refresh} />
      <section className="card overflow-hidden">
        <h2 className="border-b border-line px-3 py-2">Open invitations</h2>
        {(invitations.data ?? []).length === 0 ? (
          <p className="px-3 py-4 text-ink-soft">No open invitations.</p>
        ) : (
          <table className="table-dense" data-testid="invitations-table">
            <thead>
              <tr>
                <th>E-mail</th>
                <th>Role</th>
                <th>Expires</th>
                <th />
              </tr>
            </thead>
            <tbody>
              {(invitations.data ?? []).map((i) => (
                <tr key={i.id}>
                  <td>{i.email}</td>
                  <td>{i.role}</td>
                  <td className="tabular-nums">{formatDay(i.expiresAt)}</td>
                  <td className="text-right">
                    <button type="button" className="btn-danger py-1" onClick={() => setPendingRevoke(i)} disabled={revoke.isPending} aria-label={`Revoke the invitation of ${i.email}`}>
                      Revoke
                    </button>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>
      <ConfirmDialog
        open={!!pendingRole}
        title={`Change the role of ${pendingRole?.email ?? ""}?`}
        confirmLabel={`Make ${pendingRole?.role ?? ""}`}
        tone="primary"
        busy={changeRole.isPending}
        onConfirm={() => pendingRole && changeRole.mutate({ userId: pendingRole.userId, role: pendingRole.role })}
        onCancel={() => setPendingRole(undefined)}
      >
        {pendingRole ? `${pendingRole.email} goes from ${pendingRole.from} to ${pendingRole.role}; what they may see and change follows at once.` : null}
      </ConfirmDialog>
      <ConfirmDialog
        open={!!pendingRevoke}
        title={`Revoke the invitation of ${pendingRevoke?.email ?? ""}?`}
        confirmLabel="Revoke invitation"
        busy={revoke.isPending}
        onConfirm={() => pendingRevoke && revoke.mutate(pendingRevoke.id)}
        onCancel={() => setPendingRevoke(undefined)}
      >
        The link already mailed stops working; you can invite the same address again later.
      </ConfirmDialog>
    </div>
  );
}

function InviteForm({ onInvited }: { onInvited: () => void }) {
  const [notice, setNotice] = useState<{ kind: "error" | "info"; text: string }>();
  const form = useSchemaForm(invitationCreateSchema, { defaultValues: { email: "", role: "engineer" } });
  const { errors, isSubmitting } = form.formState;
  const onSubmit = form.handleSubmit(async (values) => {
    setNotice(undefined);
    try {
      const { invitation } = await fetchJson<{ invitation: { email: string; mailed: boolean } }>("/api/team/invitations", { method: "POST", json: values });
      setNotice({
        kind: invitation.mailed ? "info" : "error",
        text: invitation.mailed ? `Invitation sent to ${invitation.email}.` : `Invitation recorded, but the mail to ${invitation.email} could not be sent.`,
      });
      form.reset({ email: "", role: values.role });
      onInvited();
    } catch (err) {
      const text = messageAfterRefusal(err, form.setError, ["email", "role"]);
      if (text) setNotice({ kind: "error", text });
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="card grid gap-3 p-4 md:grid-cols-[2fr_1fr_auto] md:items-start" aria-label="Invite a member">
      <Field id="invite-email" label="Invite by e-mail" error={errors.email?.message}>
        <input id="invite-email" type="email" className="input" placeholder="name@company.example" aria-invalid={!!errors.email} {...form.register("email")} />
      </Field>
      <Field id="invite-role" label="Role" error={errors.role?.message}>
        <select id="invite-role" className="input" {...form.register("role")}>
          <OptionList options={ROLE_OPTIONS} />
        </select>
      </Field>
      <div className="md:pt-5">
        <button type="submit" className="btn-primary" disabled={isSubmitting}>
          Send invitation
        </button>
      </div>
      {notice ? (
        <div className="md:col-span-3">
          <FormMessage kind={notice.kind}>{notice.text}</FormMessage>
        </div>
      ) : null}
    </form>
  );
}

