'use client';
/**
 * Members page body. Everyone sees the members; owners also change roles,
 * remove members, invite by e-mail and withdraw open invitations.
 */
import { useState } from 'react';
import { apiSend, useApi, type ApiError } from '@/src/web/swr';
import { Badge, Button, Card, EmptyState, FormField, Notice, formatUtc, inputClass } from '@/src/web/ui';
import { ConfirmAction } from '@/src/web/ui/ConfirmAction';
import { useApiForm } from '@/src/web/account/useApiForm';

type Role = 'owner' | 'analyst' | 'viewer';
interface Member {
  userId: string;
  name: string;
  email: string;
  role: Role;
  joinedAt: string;
}
interface Invitation {
  id: string;
  email: string;
  role: Role;
  expiresAt: string;
}
interface Overview {
  members: Member[];
  invitations: Invitation[];
}

const ROLE_OPTIONS: { value: Role; label: string }[] = [
  { value: 'viewer', label: 'Viewer' },
  { value: 'analyst', label: 'Analyst' },
  { value: 'owner', label: 'Owner' },
];

export function MembersManager({
  networkId,
  canManage,
  currentUserId,
  initial,
}: {
  networkId: string;
  canManage: boolean;
  currentUserId: string;
  initial: Overview;
}) {
  const url = `/api/networks/${networkId}/members`;
  const { data, mutate } = useApi<Overview>(url, { fallbackData: initial });
  const [message, setMessage] = useState<{ tone: 'success' | 'error'; text: string; link?: string } | null>(null);
  const [pending, setPending] = useState<string | null>(null);
  const members = data?.members ?? [];
  const invitations = data?.invitations ?? [];

  async function act(key: string, fn: () => Promise<unknown>, ok: string) {
    setPending(key);
    setMessage(null);
    try {
      await fn();
      setMessage({ tone: 'success', text: ok });
      await mutate();
    } catch (e) {
      setMessage({ tone: 'error', text: (e as ApiError).message });
      await mutate();
    } finally {
      setPending(null);
    }
  }

  const invite = useApiForm();
  const submitInvite = invite.onSubmit(async (d) => {
    const r = await apiSend<{ invitation: Invitation; link: string; mailSent: boolean }>(
      'POST',
      `/api/networks/${networkId}/invitations`,
      {
        email: d.get('email'),
        role: d.get('role'),
      },
    );
    setMessage(
      r.mailSent
        ? { tone: 'success', text: `Invitation sent to ${r.invitation.email}. It expires in 7 days.` }
        : {
            tone: 'error',
            text: `The invitation was saved, but the e-mail could not be sent. Pass this link to ${r.invitation.email} yourself:`,
            link: r.link,
          },
    );
    await mutate();
  });

  return (
    <div className="space-y-6">
      {message ? (
        <Notice tone={message.tone}>
          {message.text}
          {message.link ? <code className="mt-1 block break-all font-mono text-xs">{message.link}</code> : null}
        </Notice>
      ) : null}

      <Card title="Members" description={`${members.length} ${members.length === 1 ? 'person' : 'people'} in this network`} flush>
        <div className="relative overflow-x-auto">
          <table className="w-full min-w-[40rem] text-sm">
            <caption className="sr-only">Members and their roles</caption>
            <thead>
              <tr className="border-b border-line text-left">
                <th scope="col" className="px-4 py-2 font-semibold">
                  Name
                </th>
                <th scope="col" className="px-4 py-2 font-semibold">
                  E-mail
                </th>
                <th scope="col" className="px-4 py-2 font-semibold">
                  Role
                </th>
                <th scope="col" className="px-4 py-2 font-semibold">
                  Joined
                </th>
                {canManage ? (
                  <th scope="col" className="px-4 py-2">
                    <span className="sr-only">Actions</span>
                  </th>
                ) : null}
              </tr>
            </thead>
            <tbody>
              {members.map((m) => (
                <tr key={m.userId} className="border-b border-line last:border-0">
                  <td className="px-4 py-2 font-medium">
                    {m.name}
                    {m.userId === currentUserId ? <span className="ml-1.5 text-xs text-muted">(you)</span> : null}
                  </td>
                  <td className="px-4 py-2 text-muted">{m.email}</td>
                  <td className="px-4 py-2">
                    {canManage ? (
                      <select
                        aria-label={`Role of ${m.name}`}
                        value={m.role}
                        disabled={pending !== null}
                        onChange={(e) =>
                          act(
                            `role-${m.userId}`,
                            () => apiSend('PATCH', `/api/networks/${networkId}/members/${m.userId}`, { role: e.target.value }),
                            `${m.name} is now ${e.target.value}.`,
                          )
                        }
                        className={`${inputClass} w-32 py-1`}
                      >
                        {ROLE_OPTIONS.map((o) => (
                          <option key={o.value} value={o.value}>
                            {o.label}
                          </option>
                        ))}
                      </select>
                    ) : (
                      <Badge tone={m.role === 'owner' ? 'accent' : 'neutral'}>{m.role}</Badge>
                    )}
                  </td>
                  <td className="num px-4 py-2 text-muted">{formatUtc(m.joinedAt).slice(0, 10)}</td>
                  {canManage ? (
                    <td className="px-4 py-2 text-right">
                      <ConfirmAction
                        label="Remove"
                        size="sm"
                        disabled={pending !== null}
                        loss={`${m.name} loses access to this network. What they stored stays.`}
                        confirmLabel={`Remove ${m.name}`}
                        onConfirm={() =>
                          act(
                            `remove-${m.userId}`,
                            () => apiSend('DELETE', `/api/networks/${networkId}/members/${m.userId}`),
                            `${m.name} was removed.`,
                          )
                        }
                      />
                    </td>
                  ) : null}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </Card>

      {canManage ? (
        <>
          <Card title="Invite a colleague" description="They get an e-mail with a link that works once, for 7 days.">
            <form onSubmit={submitInvite} noValidate className="flex flex-wrap items-start gap-3">
              <FormField id="invite-email" label="E-mail address" error={invite.fieldError('email')} className="min-w-64 flex-1">
                <input name="email" type="email" required className={inputClass} />
              </FormField>
              <FormField id="invite-role" label="Role" error={invite.fieldError('role')}>
                <select name="role" defaultValue="viewer" className={`${inputClass} w-36`}>
                  {ROLE_OPTIONS.map((o) => (
                    <option key={o.value} value={o.value}>
                      {o.label}
                    </option>
                  ))}
                </select>
              </FormField>
              <Button type="submit" busy={invite.busy} className="mt-6">
                Send invitation
              </Button>
              {invite.formError(['email', 'role']) ? (
                <Notice tone="error" className="w-full">
                  {invite.formError(['email', 'role'])}
                </Notice>
              ) : null}
            </form>
          </Card>

          <Card title="Open invitations" flush>
            {invitations.length === 0 ? (
              <div className="p-4">
                <EmptyState title="No open invitations">
                  Invite a colleague above; their invitation waits here until they accept it.
                </EmptyState>
              </div>
            ) : (
              <ul className="divide-y divide-line">
                {invitations.map((i) => (
                  <li key={i.id} className="flex flex-wrap items-center justify-between gap-3 px-4 py-2 text-sm">
                    <span>
                      <span className="font-medium">{i.email}</span> <Badge>{i.role}</Badge>
                    </span>
                    <span className="num text-muted">expires {formatUtc(i.expiresAt)}</span>
                    <Button
                      tone="quiet"
                      size="sm"
                      disabled={pending !== null}
                      onClick={() =>
                        act(
                          `revoke-${i.id}`,
                          () => apiSend('DELETE', `/api/networks/${networkId}/invitations/${i.id}`),
                          `The invitation to ${i.email} was withdrawn.`,
                        )
                      }
                    >
                      Withdraw
                    </Button>
                  </li>
                ))}
              </ul>
            )}
          </Card>
        </>
      ) : (
        <Notice>Only owners can invite people or change roles. Ask an owner of this network if something needs to change.</Notice>
      )}
    </div>
  );
}
