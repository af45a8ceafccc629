"use client";
import { useMemo, useState } from "react";
import useSWR from "swr";
import { FetchError, sendJson } from "@/lib/fetcher";
import { TextField } from "@/components/ui/text-field";
import { SortHeader, sortRows, type SortState } from "@/components/ui/sort-header";
import type { UserView } from "@/lib/server/users";

const ROLES = ["admin", "manager", "supervisor", "engineer", "purchaser", "operator"] as const;
type Column = "name" | "email" | "role" | "status";

function status(u: UserView): string {
  return !u.active ? "deactivated" : u.passwordSet ? "active" : "invited";
}

function sortValue(u: UserView, column: Column): string {
  return column === "status" ? status(u) : u[column];
}

export function UsersAdmin({ meId }: { meId: string }) {
  const { data, error, isLoading, mutate } = useSWR<{ users: UserView[] }>("/api/admin/users");
  const [sort, setSort] = useState<SortState<Column>>({ key: "email", desc: false });
  const [notice, setNotice] = useState<string | null>(null);
  const [confirming, setConfirming] = useState<string | null>(null);

  async function patch(id: string, body: { role?: string; active?: boolean }, done: string) {
    try {
      await sendJson(`/api/admin/users/${id}`, "PATCH", body);
      setNotice(done);
      await mutate();
    } catch (e) {
      setNotice(e instanceof Error ? e.message : "Not saved.");
    }
  }

  const users = useMemo(() => sortRows(data?.users ?? [], sort, sortValue), [data, sort]);
  const header = (column: Column, label: string) => <SortHeader label={label} column={column} sort={sort} onSort={setSort} />;

  function actions(u: UserView) {
    if (u.id === meId) return <span className="text-xs text-ink-faint">you</span>;
    if (!u.active) return <button className="btn-quiet" onClick={() => patch(u.id, { active: true }, `${u.email} reactivated.`)}>Reactivate</button>;
    return confirming === u.id ? (
      <span className="flex gap-2">
        <button className="btn-danger" onClick={() => { setConfirming(null); patch(u.id, { active: false }, `${u.email} deactivated; their sessions ended.`); }}>
          Yes, deactivate
        </button>
        <button className="btn-quiet" onClick={() => setConfirming(null)}>Keep</button>
      </span>
    ) : (
      <button className="btn-quiet" onClick={() => setConfirming(u.id)}>Deactivate…</button>
    );
  }

  return (
    <>
      <InviteForm onInvited={(email) => { setNotice(`Invitation e-mailed to ${email}.`); mutate(); }} />
      <p aria-live="polite" className="min-h-5 text-sm text-ink-soft">{notice}</p>
      <section className="card overflow-x-auto" aria-label="All users">
        {isLoading ? (
          <p role="status">Loading users…</p>
        ) : error ? (
          <p role="alert" className="text-oxide">Could not load users: {error.message}</p>
        ) : (
          <table className="w-full text-left text-sm">
            <thead>
              <tr className="border-b border-plate-line">
                {header("name", "Name")}
                {header("email", "E-mail")}
                {header("role", "Role")}
                {header("status", "Status")}
                <th scope="col" className="py-2 pr-3 font-medium"><span className="sr-only">Actions</span></th>
              </tr>
            </thead>
            <tbody>
              {users.map((u) => (
                <tr key={u.id} className="border-b border-plate-line/60">
                  <td className="py-2 pr-3">{u.name}</td>
                  <td className="py-2 pr-3">{u.email}</td>
                  <td className="py-2 pr-3">
                    <select
                      aria-label={`Role of ${u.email}`}
                      className="field py-1"
                      value={u.role}
                      disabled={u.id === meId}
                      onChange={(e) => patch(u.id, { role: e.target.value }, `${u.email} is now ${e.target.value}.`)}
                    >
                      {ROLES.map((r) => <option key={r} value={r}>{r}</option>)}
                    </select>
                  </td>
                  <td className="py-2 pr-3">{status(u)}</td>
                  <td className="py-2 pr-3">{actions(u)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>
    </>
  );
}

function InviteForm({ onInvited }: { onInvited: (email: string) => void }) {
  const [v, setV] = useState({ email: "", name: "", role: "operator" });
  const [fields, setFields] = useState<Record<string, string>>({});
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  return (
    <section className="card" aria-labelledby="invite-h">
      <h2 id="invite-h">Invite someone</h2>
      <p className="mb-3 text-sm text-ink-soft">They get an e-mail with a link to set their password. The link works once, for 72 hours.</p>
      <form
        className="grid items-end gap-3 sm:grid-cols-[1fr_1fr_12rem_auto]"
        noValidate
        onSubmit={async (e) => {
          e.preventDefault();
          setBusy(true);
          setError(null);
          try {
            await sendJson("/api/admin/users", "POST", v);
            setFields({});
            onInvited(v.email);
            setV({ email: "", name: "", role: v.role });
          } catch (err) {
            setFields(err instanceof FetchError ? err.fields : {});
            setError(err instanceof Error ? err.message : "Not sent.");
          } finally {
            setBusy(false);
          }
        }}
      >
        <TextField label="E-mail" name="email" type="email" value={v.email} error={fields.email} onChange={(s) => setV({ ...v, email: s })} />
        <TextField label="Name" name="name" value={v.name} error={fields.name} onChange={(s) => setV({ ...v, name: s })} />
        <div>
          <label className="label" htmlFor="invite-role">Role</label>
          <select id="invite-role" className="field" value={v.role} onChange={(e) => setV({ ...v, role: e.target.value })}>
            {ROLES.map((r) => <option key={r} value={r}>{r}</option>)}
          </select>
        </div>
        <button className="btn-primary" disabled={busy}>Send invitation</button>
      </form>
      {error && !Object.keys(fields).length && <p role="alert" className="field-error">{error}</p>}
    </section>
  );
}
