"use client";
import { useMemo, useState } from "react";
import useSWR from "swr";
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  getSortedRowModel,
  useReactTable,
  type SortingState,
} from "@tanstack/react-table";
import { FetchError, sendJson } from "@/lib/fetcher";
import { TextField } from "@/components/ui/text-field";
import type { UserView } from "@/lib/server/users";

const ROLES = ["admin", "manager", "supervisor", "engineer", "purchaser", "operator"] as const;
const col = createColumnHelper<UserView>();

export function UsersAdmin({ meId }: { meId: string }) {
  const { data, error, isLoading, mutate } = useSWR<{ users: UserView[] }>("/api/admin/users");
  const [sorting, setSorting] = useState<SortingState>([{ id: "email", desc: false }]);
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

  const columns = useMemo(
    () => [
      col.accessor("name", { header: "Name" }),
      col.accessor("email", { header: "E-mail" }),
      col.accessor("role", {
        header: "Role",
        cell: (c) => (
          <select
            aria-label={`Role of ${c.row.original.email}`}
            className="field py-1"
            value={c.getValue()}
            disabled={c.row.original.id === meId}
            onChange={(e) => patch(c.row.original.id, { role: e.target.value }, `${c.row.original.email} is now ${e.target.value}.`)}
          >
            {ROLES.map((r) => <option key={r} value={r}>{r}</option>)}
          </select>
        ),
      }),
      col.accessor((u) => (!u.active ? "deactivated" : u.passwordSet ? "active" : "invited"), { id: "status", header: "Status" }),
      col.display({
        id: "actions",
        header: () => <span className="sr-only">Actions</span>,
        cell: (c) => {
          const u = c.row.original;
          if (u.id === meId) return <span className="text-xs text-ink-faint">you</span>;
          if (!u.active)
            return <button className="btn-quiet" onClick={() => patch(u.id, { active: true }, `${u.email} reactivated.`)}>Reactivate</button>;
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
        },
      }),
    ],
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [meId, confirming],
  );

  const table = useReactTable({
    data: data?.users ?? [],
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });

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
              {table.getHeaderGroups().map((hg) => (
                <tr key={hg.id} className="border-b border-plate-line">
                  {hg.headers.map((h) => (
                    <th key={h.id} className="py-2 pr-3 font-medium" aria-sort={h.column.getIsSorted() === "asc" ? "ascending" : h.column.getIsSorted() === "desc" ? "descending" : undefined}>
                      {h.column.getCanSort() ? (
                        <button className="flex items-center gap-1" onClick={h.column.getToggleSortingHandler()}>
                          {flexRender(h.column.columnDef.header, h.getContext())}
                          <span aria-hidden>{h.column.getIsSorted() === "asc" ? "▲" : h.column.getIsSorted() === "desc" ? "▼" : "↕"}</span>
                        </button>
                      ) : (
                        flexRender(h.column.columnDef.header, h.getContext())
                      )}
                    </th>
                  ))}
                </tr>
              ))}
            </thead>
            <tbody>
              {table.getRowModel().rows.map((r) => (
                <tr key={r.id} className="border-b border-plate-line/60">
                  {r.getVisibleCells().map((c) => (
                    <td key={c.id} className="py-2 pr-3">{flexRender(c.column.columnDef.cell, c.getContext())}</td>
                  ))}
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
