'use client';

import { useMemo, useState } from 'react';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useForm, useWatch, type Resolver } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { createColumnHelper, flexRender, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import type { z } from 'zod';
import { api, ApiError } from '@/lib/api/client';
import type { Member } from '@/lib/db/users';
import { memberCreateSchema, type MemberCreate } from '@/lib/validations/auth';
import { isOutsideRole, roleLabels, roles, type Role } from '@/lib/auth/roles';
import type { Organisation } from '@/lib/db/organisations';
import { Card, Notice } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import { Field, Input, Select } from '@/components/ui/field';
import { useOrganisations } from '@/components/styles/use-styles';

const col = createColumnHelper<Member>();

type MemberChange = Partial<{ role: Role; active: boolean; organisationId: string }>;

/**
 * The role select of one member. A change to a studio role is sent at once; a mill or client account
 * belongs to an organisation of that kind, so for those the organisation is asked for first.
 */
function RoleCell({ member, organisations, onChange }: { member: Member; organisations: Organisation[]; onChange: (body: MemberChange) => void }) {
  const [asked, setAsked] = useState<'mill' | 'client' | null>(null);
  const [organisationId, setOrganisationId] = useState('');
  const choices = asked ? organisations.filter((o) => o.kind === asked) : [];
  const kindWord = asked === 'mill' ? 'mill' : 'client';
  return (
    <div className="space-y-1.5">
      <Select
        aria-label={`Role of ${member.name}`}
        className="h-8 w-40"
        value={asked ?? member.role}
        disabled={!member.active}
        onChange={(e) => {
          const role = e.target.value as Role;
          setOrganisationId('');
          if (role === member.role) setAsked(null);
          else if (isOutsideRole(role)) setAsked(role);
          else { setAsked(null); onChange({ role }); }
        }}
      >
        {roles.map((r) => <option key={r} value={r}>{roleLabels[r]}</option>)}
      </Select>
      {asked ? (
        <div className="flex items-center gap-1.5">
          <Select aria-label={`The ${kindWord} ${member.name} belongs to`} className="h-8 w-40" value={organisationId} onChange={(e) => setOrganisationId(e.target.value)}>
            <option value="">{choices.length ? `Choose the ${kindWord}…` : `No ${kindWord} in the studio`}</option>
            {choices.map((o) => <option key={o.id} value={o.id}>{o.name}</option>)}
          </Select>
          <Button size="sm" variant="primary" disabled={!organisationId} onClick={() => { onChange({ role: asked, organisationId }); setAsked(null); }}>Change</Button>
          <Button size="sm" variant="ghost" onClick={() => setAsked(null)}>Cancel</Button>
        </div>
      ) : null}
    </div>
  );
}

export function MembersAdmin({ selfId }: { selfId: string }) {
  const qc = useQueryClient();
  const members = useQuery({ queryKey: ['members'], queryFn: () => api<{ members: Member[] }>('/api/members').then((r) => r.members) });
  const orgs = useOrganisations();
  const organisations = orgs.data;
  const [error, setError] = useState<string | null>(null);
  const patch = useMutation({
    mutationFn: ({ id, body }: { id: string; body: MemberChange }) =>
      api(`/api/members/${id}`, { method: 'PATCH', json: body }),
    onSuccess: () => { setError(null); return qc.invalidateQueries({ queryKey: ['members'] }); },
    onError: (err) => setError(err instanceof ApiError ? err.message : 'That did not work.'),
  });

  const columns = useMemo(
    () => [
      col.accessor('name', { header: 'Name', cell: (c) => <span className="font-medium">{c.getValue()}</span> }),
      col.accessor('email', { header: 'E-mail', cell: (c) => <span className="figures text-[13px]">{c.getValue()}</span> }),
      col.accessor('role', {
        header: 'Role',
        cell: (c) => (
          <RoleCell
            member={c.row.original}
            organisations={organisations ?? []}
            onChange={(body) => patch.mutate({ id: c.row.original.id, body })}
          />
        ),
      }),
      col.accessor((m) => m.organisationName ?? 'Studio', { id: 'org', header: 'Organisation' }),
      col.accessor('active', {
        header: 'Status',
        cell: (c) => (c.getValue() ? <span className="text-spruce-700">Active</span> : <span className="text-ink-faint">Deactivated</span>),
      }),
      col.display({
        id: 'actions',
        header: '',
        cell: (c) =>
          c.row.original.id === selfId ? <span className="text-xs text-ink-faint">You</span> : (
            <Button size="sm" variant={c.row.original.active ? 'danger' : 'secondary'} onClick={() => patch.mutate({ id: c.row.original.id, body: { active: !c.row.original.active } })}>
              {c.row.original.active ? 'Deactivate' : 'Reactivate'}
            </Button>
          ),
      }),
    ],
    [patch, selfId, organisations],
  );
  const table = useReactTable({ data: members.data ?? [], columns, getCoreRowModel: getCoreRowModel() });

  return (
    <div className="grid grid-cols-1 gap-5 xl:grid-cols-[1fr_360px]">
      <Card title="Members">
        {error ? <div className="mb-3"><Notice tone="error">{error}</Notice></div> : null}
        {members.isLoading ? <p className="text-sm text-ink-soft">Loading…</p> : members.error ? <Notice tone="error">{members.error.message}</Notice> : (
          <table className="w-full text-left text-sm">
            <thead className="border-b border-rule text-xs text-ink-soft">
              {table.getHeaderGroups().map((hg) => (
                <tr key={hg.id}>{hg.headers.map((h) => <th key={h.id} className="px-2 py-2 font-medium">{flexRender(h.column.columnDef.header, h.getContext())}</th>)}</tr>
              ))}
            </thead>
            <tbody>
              {table.getRowModel().rows.map((r) => (
                <tr key={r.id} className="border-b border-rule/70 last:border-0">
                  {r.getVisibleCells().map((c) => <td key={c.id} className="px-2 py-2">{flexRender(c.column.columnDef.cell, c.getContext())}</td>)}
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </Card>
      <AddMember />
    </div>
  );
}

type FormIn = z.input<typeof memberCreateSchema>;

function AddMember() {
  const qc = useQueryClient();
  const orgs = useOrganisations();
  const [done, setDone] = useState<string | null>(null);
  const [serverError, setServerError] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError, reset, control } = useForm<FormIn, unknown, MemberCreate>({
    resolver: zodResolver(memberCreateSchema) as Resolver<FormIn, unknown, MemberCreate>,
    defaultValues: { email: '', name: '', role: 'designer', password: '', organisationId: null },
  });
  const role = useWatch({ control, name: 'role' });
  const outside = role === 'client' || role === 'mill';
  const e = formState.errors;

  const onSubmit = handleSubmit(async (values) => {
    setServerError(null);
    setDone(null);
    try {
      await api('/api/members', { method: 'POST', json: values });
      setDone(`${values.name} can now sign in.`);
      reset();
      await qc.invalidateQueries({ queryKey: ['members'] });
    } catch (err) {
      if (err instanceof ApiError) {
        for (const [path, msgs] of Object.entries(err.fieldErrors)) setError(path as keyof FormIn, { message: msgs[0] });
        setServerError(err.message);
      }
    }
  });

  return (
    <Card title="Add a member">
      <form onSubmit={onSubmit} noValidate className="space-y-3">
        {serverError ? <Notice tone="error">{serverError}</Notice> : null}
        {done ? <Notice>{done}</Notice> : null}
        <Field label="Name" error={e.name?.message}>{(id) => <Input id={id} {...register('name')} />}</Field>
        <Field label="E-mail" error={e.email?.message}>{(id) => <Input id={id} type="email" {...register('email')} />}</Field>
        <Field label="Role" error={e.role?.message}>
          {(id) => <Select id={id} {...register('role')}>{roles.map((r) => <option key={r} value={r}>{roleLabels[r]}</option>)}</Select>}
        </Field>
        {outside ? (
          <Field label={role === 'mill' ? 'Mill' : 'Client'} error={e.organisationId?.message}>
            {(id) => (
              <Select id={id} {...register('organisationId', { setValueAs: (v) => (v ? v : null) })}>
                <option value="">Choose…</option>
                {(orgs.data ?? []).filter((o) => o.kind === role).map((o) => <option key={o.id} value={o.id}>{o.name}</option>)}
              </Select>
            )}
          </Field>
        ) : null}
        <Field label="First password" error={e.password?.message} hint="At least 10 characters; share it privately">
          {(id) => <Input id={id} type="password" autoComplete="new-password" {...register('password')} />}
        </Field>
        <Button type="submit" variant="primary" disabled={formState.isSubmitting}>Add member</Button>
      </form>
    </Card>
  );
}
