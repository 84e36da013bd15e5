/**
 * Who may see what about the people in a household. Members' e-mail addresses and the body data
 * behind a person's need (age, birth dates, height, weight, pregnancy, breastfeeding, and the
 * notes of the estimate, which can name them) are the owner's to see; growers and viewers see a
 * person's name, when they eat here and the energy they need, and each member's name and role.
 */
import type { RoleValue } from './household-schemas';
import type { MemberJson, PersonJson, PersonSummaryJson } from './api-types';

/** Whether this role sees members' addresses and people's body data. */
export function seesPrivateData(role: RoleValue): boolean {
  return role === 'owner';
}

/**
 * A person as a grower or viewer sees them: name, presence, share of meals at home and the
 * energy need, nothing that tells age, size or pregnancy.
 * @example summarisePerson(rosa).energy // { kcalPerDay: 2100, atHomeKcalPerDay: 2100, basis: 'EER' }
 */
export function summarisePerson(p: PersonJson): PersonSummaryJson {
  return {
    id: p.id,
    name: p.name,
    atHomePct: p.atHomePct,
    presentFrom: p.presentFrom,
    presentTo: p.presentTo,
    energy: p.energy ? { kcalPerDay: p.energy.kcalPerDay, atHomeKcalPerDay: p.energy.atHomeKcalPerDay, basis: p.energy.basis } : null,
    bodyDataHidden: true,
  };
}

/** The person as `role` may see them. */
export function personFor(role: RoleValue, p: PersonJson): PersonJson | PersonSummaryJson {
  return seesPrivateData(role) ? p : summarisePerson(p);
}

/**
 * A member as `role` may see them: owners see every address, others only their own.
 * @example memberFor('viewer', 'u1', { userId: 'u2', email: 'a@b.c', … }).email // undefined
 */
export function memberFor(role: RoleValue, viewerId: string, m: MemberJson): MemberJson {
  if (seesPrivateData(role) || m.userId === viewerId) return m;
  const { email: _hidden, ...rest } = m;
  return rest;
}
