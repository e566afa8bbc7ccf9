/**
 * Network, membership and invitation operations behind the network routes.
 * Permission checks happen in the routes (permissions.ts); these functions
 * validate, call the repository and send the invitation e-mail.
 */
import { record } from '@/src/audit';
import { getUserById } from '@/db/repo/users';
import { z } from 'zod';
import {
  acceptInvitation,
  changeMemberRole as setMemberRole,
  createInvitation,
  createNetwork,
  findOpenInvitation,
  listMembers,
  listNetworksForUser,
  listOpenInvitations,
  removeMember as deleteMembership,
  renameNetwork,
  revokeInvitation,
  type InvitationView,
  type Role,
} from '@/db/repo/networks';
import { sendMail } from '@/src/server/mail';
import { assertMayInvite } from './mail-limits';
import { emailSchema, nameSchema, newUserId } from './accounts';
import { hashPassword, passwordSchema } from './password';
import { hashToken, INVITATION_LIFETIME_MS, newToken } from './tokens';
import { ROLES, ROLE_LABEL } from './permissions';
import { unauthorized } from '@/src/server/errors';
import { authenticate } from './accounts';
import { startSession, type User } from './session';

export const networkNameSchema = z
  .string({ error: 'Enter a name for the network.' })
  .trim()
  .min(1, { error: 'Enter a name for the network.' })
  .max(120, { error: 'Keep the network name to 120 characters or fewer.' });

export const roleSchema = z.enum(ROLES as [Role, ...Role[]], { error: 'Choose a role: owner, analyst or viewer.' });

export const createNetworkSchema = z.object({ name: networkNameSchema });
export const inviteSchema = z.object({ email: emailSchema, role: roleSchema });
export const roleChangeSchema = z.object({ role: roleSchema });
export const acceptSchema = z.discriminatedUnion(
  'mode',
  [
    z.object({ mode: z.literal('current') }),
    z.object({ mode: z.literal('sign-up'), name: nameSchema, password: passwordSchema }),
    z.object({ mode: z.literal('sign-in'), password: z.string().min(1, { error: 'Enter your password.' }) }),
  ],
  { error: 'Say how to accept: mode "current", "sign-up" or "sign-in".' },
);

export { createNetwork, renameNetwork, listMembers, listNetworksForUser, revokeInvitation };

async function memberLabel(userId: string): Promise<string> {
  const u = await getUserById(userId);
  return u ? `${u.name} <${u.email}>` : 'a former account';
}

/** A member's new role (the last owner stays an owner), recorded in the audit trail. */
export async function changeMemberRole(networkId: string, userId: string, role: Role, actorId: string | null): Promise<void> {
  await setMemberRole(networkId, userId, role);
  const summary = `member ${await memberLabel(userId)} is now ${ROLE_LABEL[role].toLowerCase()}`;
  await record({ networkId, actorId, action: 'changed', subject: 'member', subjectId: userId, summary });
}

/** Takes a member out of the network (never the last owner), recorded in the audit trail. */
export async function removeMember(networkId: string, userId: string, actorId: string | null): Promise<void> {
  const label = await memberLabel(userId);
  await deleteMembership(networkId, userId);
  await record({ networkId, actorId, action: 'deleted', subject: 'member', subjectId: userId, summary: `member ${label}` });
}

export async function membersOverview(networkId: string, includeInvitations: boolean) {
  const [members, invitations] = await Promise.all([
    listMembers(networkId),
    includeInvitations ? listOpenInvitations(networkId, new Date()) : Promise.resolve([]),
  ]);
  return { members, invitations };
}

export interface InviteResult {
  invitation: { id: string; email: string; role: Role; expiresAt: Date };
  /** The link to accept; shown to the owner too, so it can be passed on if mail fails. */
  link: string;
  mailSent: boolean;
}

export async function inviteMember(
  networkId: string,
  networkName: string,
  inviter: User,
  input: z.infer<typeof inviteSchema>,
  origin: string,
  now = new Date(),
): Promise<InviteResult> {
  await assertMayInvite(inviter.id, now);
  const token = newToken();
  const row = await createInvitation({
    networkId,
    email: input.email,
    role: input.role,
    tokenHash: hashToken(token),
    invitedBy: inviter.id,
    expiresAt: new Date(now.getTime() + INVITATION_LIFETIME_MS),
    createdAt: now,
  });
  const link = `${origin}/invitations/${encodeURIComponent(token)}`;
  let mailSent = true;
  try {
    await sendMail({
      to: row.email,
      subject: `Cavitas: ${inviter.name} invites you to ${networkName}`,
      text:
        `Hello,\n\n${inviter.name} (${inviter.email}) invites you to join the network "${networkName}" on Cavitas ` +
        `as ${ROLE_LABEL[row.role].toLowerCase()}.\n\nAccept within 7 days:\n\n${link}\n\n` +
        `The link works once. If you do not know the sender, ignore this message.\n`,
    });
  } catch (e) {
    mailSent = false;
    console.error('[cavitas] invitation mail could not be sent', e);
  }
  return { invitation: { id: row.id, email: row.email, role: row.role, expiresAt: row.expiresAt }, link, mailSent };
}

export async function viewInvitation(token: string): Promise<InvitationView> {
  return findOpenInvitation(hashToken(token), new Date());
}

/**
 * Accept as the signed-in user, by creating an account, or by signing in
 * with the invited address's password. Joining happens in one transaction.
 */
export async function acceptInvitationAs(
  token: string,
  input: z.infer<typeof acceptSchema>,
  currentUser: User | null,
  address: string,
): Promise<{ networkId: string; role: Role; cookie: string | null }> {
  const tokenHash = hashToken(token);
  const now = new Date();
  if (input.mode === 'current') {
    if (!currentUser) throw unauthorized('Sign in, or create an account, to accept this invitation.');
    const r = await acceptInvitation(tokenHash, { userId: currentUser.id, email: currentUser.email }, now);
    return { networkId: r.networkId, role: r.role, cookie: null };
  }
  if (input.mode === 'sign-up') {
    const view = await findOpenInvitation(tokenHash, now);
    const r = await acceptInvitation(
      tokenHash,
      { newUser: { id: newUserId(), email: view.email, name: input.name, passwordHash: await hashPassword(input.password) } },
      now,
    );
    return { networkId: r.networkId, role: r.role, cookie: await startSession(r.userId) };
  }
  const view = await findOpenInvitation(tokenHash, now);
  const user = await authenticate(view.email, input.password, address, now);
  const r = await acceptInvitation(tokenHash, { userId: user.id, email: user.email }, now);
  return { networkId: r.networkId, role: r.role, cookie: await startSession(user.id) };
}
