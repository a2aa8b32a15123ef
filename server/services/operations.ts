// Operation rules: creating an operation, listing members, invitations by e-mail, role changes and removal.
import { Op, type Sequelize, type Transaction } from 'sequelize'
import { AppError } from '../errors'
import { Invitation, Membership, Operation, User } from '../models/index'
import type { Role } from '../../shared/schemas/roles'
import type { Mailer } from '../mail/mailer'
import type { Config } from '../config'
import { hashToken, newToken } from './tokens'

const INVITE_TTL_MS = 7 * 24 * 60 * 60 * 1000

export async function createOperation(sequelize: Sequelize, user: User, input: { name: string; species: 'cattle' | 'sheep' | 'both' }) {
  return sequelize.transaction(async (transaction) => {
    const op = await Operation.create({ name: input.name, species: input.species }, { transaction })
    await Membership.create({ userId: user.id, operationId: op.id, role: 'owner' }, { transaction })
    return op
  })
}

export async function listMembers(operationId: number) {
  const members = await Membership.findAll({ where: { operationId }, include: [{ model: User, as: 'user' }], order: [['id', 'ASC']] })
  const invites = await Invitation.findAll({
    where: { operationId, acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: new Date() } },
    order: [['id', 'ASC']],
  })
  return {
    members: members.map((m) => {
      const u = (m as unknown as { user: User }).user
      return { id: m.id, userId: u.id, name: u.name, email: u.email, role: m.role, since: m.createdAt }
    }),
    invitations: invites.map((i) => ({ id: i.id, email: i.email, role: i.role, expiresAt: i.expiresAt, createdAt: i.createdAt })),
  }
}

export async function invite(config: Config, mailer: Mailer, operation: Operation, inviter: User, email: string, role: Role) {
  const existingUser = await User.findOne({ where: { email } })
  if (existingUser) {
    const already = await Membership.findOne({ where: { userId: existingUser.id, operationId: operation.id } })
    if (already) throw new AppError(409, 'already_member', `${email} is already a member of ${operation.name}.`, [{ field: 'email', message: 'Already a member.' }])
  }
  const { token, hash } = newToken()
  const inv = await Invitation.create({
    operationId: operation.id,
    email,
    role,
    tokenHash: hash,
    invitedBy: inviter.id,
    expiresAt: new Date(Date.now() + INVITE_TTL_MS),
  })
  const link = `${config.publicUrl}/accept-invite?token=${encodeURIComponent(token)}`
  await mailer.send({
    to: email,
    subject: `${inviter.name} invites you to ${operation.name} on StandGraze`,
    text: `${inviter.name} invites you to join ${operation.name} on StandGraze as ${role}.\n\nOpen this link to accept (it works once, for 7 days):\n\n${link}\n\nIf you have no account yet, you can create one from that page.\n`,
  })
  return { id: inv.id, email: inv.email, role: inv.role, expiresAt: inv.expiresAt }
}

export async function findInvitation(token: string) {
  const inv = await Invitation.findOne({
    where: { tokenHash: hashToken(token), acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: new Date() } },
    include: [{ model: Operation, as: 'operation' }],
  })
  if (!inv) throw new AppError(404, 'invalid_invitation', 'This invitation is invalid, already used or expired.')
  const op = (inv as unknown as { operation: Operation }).operation
  return { email: inv.email, role: inv.role, operationName: op.name, operationId: op.id }
}

/** Joins the user to the invitation's operation; the token works once. */
export async function acceptInvitation(user: User, token: string, transaction: Transaction) {
  const inv = await Invitation.findOne({
    where: { tokenHash: hashToken(token), acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: new Date() } },
    transaction,
    lock: transaction.LOCK.UPDATE,
  })
  if (!inv) throw new AppError(400, 'invalid_invitation', 'This invitation is invalid, already used or expired.', [{ field: 'inviteToken', message: 'Invalid or expired.' }])
  const existing = await Membership.findOne({ where: { userId: user.id, operationId: inv.operationId }, transaction })
  if (!existing) await Membership.create({ userId: user.id, operationId: inv.operationId, role: inv.role }, { transaction })
  inv.acceptedAt = new Date()
  inv.acceptedBy = user.id
  await inv.save({ transaction })
  return { operationId: inv.operationId, role: existing?.role ?? inv.role }
}

export async function revokeInvitation(operationId: number, id: number) {
  const inv = await Invitation.findOne({ where: { id, operationId, acceptedAt: null, revokedAt: null } })
  if (!inv) throw AppError.notFound('Invitation')
  inv.revokedAt = new Date()
  await inv.save()
}

async function ownersLeft(operationId: number, transaction: Transaction) {
  return Membership.count({ where: { operationId, role: 'owner' }, transaction })
}

export async function changeRole(sequelize: Sequelize, operationId: number, membershipId: number, role: Role) {
  return sequelize.transaction(async (transaction) => {
    const m = await Membership.findOne({ where: { id: membershipId, operationId }, transaction, lock: transaction.LOCK.UPDATE })
    if (!m) throw AppError.notFound('Member')
    if (m.role === 'owner' && role !== 'owner' && (await ownersLeft(operationId, transaction)) <= 1) {
      throw new AppError(409, 'last_owner', 'An operation needs at least one owner. Make someone else owner first.')
    }
    m.role = role
    await m.save({ transaction })
    return m
  })
}

export async function removeMember(sequelize: Sequelize, operationId: number, membershipId: number) {
  return sequelize.transaction(async (transaction) => {
    const m = await Membership.findOne({ where: { id: membershipId, operationId }, transaction, lock: transaction.LOCK.UPDATE })
    if (!m) throw AppError.notFound('Member')
    if (m.role === 'owner' && (await ownersLeft(operationId, transaction)) <= 1) {
      throw new AppError(409, 'last_owner', 'An operation needs at least one owner. Make someone else owner first.')
    }
    await m.destroy({ transaction })
  })
}
