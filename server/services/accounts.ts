// Account rules: sign-up, sign-in, password change, password reset by e-mailed single-use token.
import bcrypt from 'bcryptjs'
import { Op, type Sequelize } from 'sequelize'
import { AppError } from '../errors'
import { Membership, Operation, PasswordReset, User } from '../models/index'
import type { Me } from '../../shared/schemas/auth'
import type { Mailer } from '../mail/mailer'
import type { Config } from '../config'
import { hashToken, newToken } from './tokens'
import { acceptInvitation } from './operations'

const RESET_TTL_MS = 60 * 60 * 1000
// A fixed hash compared against when the e-mail is unknown, so timing does not reveal which accounts exist.
let dummyHash: string | null = null

export async function signUp(
  sequelize: Sequelize,
  config: Config,
  input: { name: string; email: string; password: string; inviteToken?: string },
) {
  const passwordHash = await bcrypt.hash(input.password, config.bcryptCost)
  return sequelize.transaction(async (transaction) => {
    const existing = await User.findOne({ where: { email: input.email }, transaction })
    if (existing) throw new AppError(409, 'email_taken', 'An account with this e-mail already exists. Sign in instead.', [{ field: 'email', message: 'Already registered.' }])
    const user = await User.create({ name: input.name, email: input.email, passwordHash }, { transaction })
    if (input.inviteToken) await acceptInvitation(user, input.inviteToken, transaction)
    return user
  })
}

export async function signIn(config: Config, email: string, password: string) {
  const user = await User.findOne({ where: { email } })
  if (!user || user.disabled) {
    dummyHash ??= await bcrypt.hash('not-a-real-password', config.bcryptCost)
    await bcrypt.compare(password, dummyHash)
    throw new AppError(401, 'bad_credentials', 'E-mail or password is wrong.')
  }
  if (!(await bcrypt.compare(password, user.passwordHash))) throw new AppError(401, 'bad_credentials', 'E-mail or password is wrong.')
  return user
}

export async function changePassword(config: Config, user: User, currentPassword: string, newPassword: string) {
  if (!(await bcrypt.compare(currentPassword, user.passwordHash))) {
    throw new AppError(400, 'validation_failed', 'The current password is wrong.', [{ field: 'currentPassword', message: 'Wrong password.' }])
  }
  user.passwordHash = await bcrypt.hash(newPassword, config.bcryptCost)
  // Bumping the version signs out every other session of this user.
  user.tokenVersion = user.tokenVersion + 1
  await user.save()
  return user
}

/** Always answers the same way whether or not the address is registered. */
export async function requestPasswordReset(config: Config, mailer: Mailer, email: string) {
  const user = await User.findOne({ where: { email } })
  if (!user || user.disabled) return
  const { token, hash } = newToken()
  await PasswordReset.create({ userId: user.id, tokenHash: hash, expiresAt: new Date(Date.now() + RESET_TTL_MS) })
  const link = `${config.publicUrl}/reset-password?token=${encodeURIComponent(token)}`
  await mailer.send({
    to: user.email,
    subject: 'Reset your StandGraze password',
    text: `Hello ${user.name},\n\nSomeone (we hope you) asked to reset the password of your StandGraze account.\nOpen this link within one hour to choose a new password:\n\n${link}\n\nIf you did not ask, ignore this message; your password stays as it is.\n`,
  })
}

export async function confirmPasswordReset(sequelize: Sequelize, config: Config, token: string, password: string) {
  const passwordHash = await bcrypt.hash(password, config.bcryptCost)
  return sequelize.transaction(async (transaction) => {
    const reset = await PasswordReset.findOne({
      where: { tokenHash: hashToken(token), usedAt: null, expiresAt: { [Op.gt]: new Date() } },
      transaction,
      lock: transaction.LOCK.UPDATE,
    })
    if (!reset) throw new AppError(400, 'invalid_token', 'This reset link is invalid, used or expired. Ask for a new one.', [{ field: 'token', message: 'Invalid or expired.' }])
    const user = await User.findByPk(reset.userId, { transaction })
    if (!user) throw new AppError(400, 'invalid_token', 'This reset link is invalid.', [{ field: 'token', message: 'Invalid.' }])
    reset.usedAt = new Date()
    await reset.save({ transaction })
    user.passwordHash = passwordHash
    user.tokenVersion = user.tokenVersion + 1
    await user.save({ transaction })
    return user
  })
}

export async function describeUser(user: User): Promise<Me> {
  const memberships = await Membership.findAll({
    where: { userId: user.id },
    include: [{ model: Operation, as: 'operation' }],
    order: [['id', 'ASC']],
  })
  return {
    id: user.id,
    name: user.name,
    email: user.email,
    isAdmin: user.isAdmin,
    unitSystem: user.unitSystem,
    memberships: memberships.map((m) => {
      const op = (m as unknown as { operation: Operation }).operation
      return { operationId: m.operationId, operationName: op.name, role: m.role, isDemo: op.isDemo }
    }),
  }
}
