// Shared set-up for the nutrition API tests: an operation with an owner, a nutritionist and a hand, and a second operation of another owner.
import { addMember, makeOperation, makeUser, signIn, type Session } from '../../fixtures/builders'
import type { TestApp } from '../../helpers/app'
import type { Operation, User } from '../../../server/models/index'

export type Team = {
  op: Operation
  other: Operation
  owner: User
  sessions: { owner: Session; nutritionist: Session; hand: Session; outsider: Session }
  url: (path: string) => string
  otherUrl: (path: string) => string
}

export async function makeTeam(t: TestApp): Promise<Team> {
  const owner = await makeUser()
  const op = await makeOperation(owner)
  const nutritionist = await makeUser()
  const hand = await makeUser()
  await addMember(op, nutritionist, 'nutritionist')
  await addMember(op, hand, 'hand')
  const outsider = await makeUser()
  const other = await makeOperation(outsider)
  return {
    op,
    other,
    owner,
    sessions: { owner: await signIn(t.app, owner), nutritionist: await signIn(t.app, nutritionist), hand: await signIn(t.app, hand), outsider: await signIn(t.app, outsider) },
    url: (p) => `/api/operations/${op.id}${p}`,
    otherUrl: (p) => `/api/operations/${other.id}${p}`,
  }
}

export function fieldsOf(res: { body: { error?: { fields?: { field: string }[] } } }): string[] {
  return (res.body.error?.fields ?? []).map((f) => f.field)
}
