/**
 * People who eat in a household, in the database. Every query is scoped by the household id, so a
 * person of another household is simply not found (the route answers 404).
 */
import { and, asc, eq, getTableColumns, sql } from 'drizzle-orm';
import { getDb, getPool } from '@/db/client';
import { people, type Person } from '@/db/schema';
import type { PersonJson } from '@/lib/api-types';
import { todayIn } from '@/lib/months';
import { monthOf } from '@/lib/months';
import { mergePerson, needsPerson, personInput, type PersonFields, type PersonInput, type PersonPatch } from '@/lib/people-schemas';
import { personEnergy } from '@/lib/person-energy';
import { parseRouteId } from '@/lib/route-id';
import { HttpError } from './http';
import { rawQuery, readFields, selectList } from './raw-query';


/** The stored fields of a row, as the schemas name them. */
export function personFields(row: Person): PersonFields {
  return {
    name: row.name,
    sex: row.sex,
    ageYears: row.ageYears,
    birthYear: row.birthYear,
    heightCm: row.heightCm,
    weightKg: row.weightKg,
    activity: row.activity,
    condition: row.condition,
    kcalPerDay: row.kcalPerDay,
    atHomePct: row.atHomePct,
    presentFrom: row.presentFrom,
    presentTo: row.presentTo,
    birthMonth: row.birthMonth,
    pregnancyDueMonth: row.pregnancyDueMonth,
    lactationFrom: row.lactationFrom,
    lactationTo: row.lactationTo,
    fedFromHousehold: row.fedFromHousehold,
    diet: row.diet,
  };
}

/** A person as the API answers: stored fields plus this month's energy need and its basis. */
export function personJson(row: Person, month: string): PersonJson {
  const fields = personFields(row);
  return { id: row.id, ...fields, energy: personEnergy(needsPerson(fields), month) };
}

/** The current month in the household's time zone, e.g. '2026-07'. */
export function currentMonth(timeZone: string, now: Date = new Date()): string {
  return monthOf(todayIn(timeZone, now));
}

const personColumns = getTableColumns(people);

const peopleOf = rawQuery<Record<string, unknown>>(sql`
    SELECT ${selectList(personColumns)} FROM ${people}
     WHERE ${eq(people.householdId, sql.placeholder('householdId'))}
     ORDER BY ${asc(people.name)}, ${asc(people.id)}`);

/** Everyone who eats in the household, by name (a prepared statement: every share report asks, raw-query.ts). */
export async function listPeople(householdId: number): Promise<Person[]> {
  return (await peopleOf.run(getPool(), { householdId })).map((raw) => readFields(personColumns, raw));
}

/** One person of the household, or a 404 when the id is not one of its people. */
export async function getPerson(householdId: number, personId: number): Promise<Person> {
  const [row] = await getDb()
    .select()
    .from(people)
    .where(and(eq(people.householdId, householdId), eq(people.id, personId)))
    .limit(1);
  if (!row) throw new HttpError(404, 'not_found', 'No such person in this household.');
  return row;
}

/** Adds a person to the household. */
export async function createPerson(householdId: number, input: PersonInput): Promise<Person> {
  const [res] = await getDb().insert(people).values({ ...input, householdId });
  return getPerson(householdId, res.insertId);
}

/** Applies a patch to a person; the merged person must pass every rule again (400 otherwise). */
export async function updatePerson(householdId: number, personId: number, patch: PersonPatch): Promise<Person> {
  return getDb().transaction(async (tx) => {
    const [row] = await tx
      .select()
      .from(people)
      .where(and(eq(people.householdId, householdId), eq(people.id, personId)))
      .for('update');
    if (!row) throw new HttpError(404, 'not_found', 'No such person in this household.');
    const next = personInput.parse(mergePerson(personFields(row), patch));
    await tx.update(people).set(next).where(and(eq(people.householdId, householdId), eq(people.id, personId)));
    const [updated] = await tx.select().from(people).where(eq(people.id, personId));
    return updated!;
  });
}

/** Removes a person from the household; a 404 when the id is not one of its people. */
export async function deletePerson(householdId: number, personId: number): Promise<void> {
  const [res] = await getDb()
    .delete(people)
    .where(and(eq(people.householdId, householdId), eq(people.id, personId)));
  if (res.affectedRows === 0) throw new HttpError(404, 'not_found', 'No such person in this household.');
}

/** The person id of a route, or a 404 for anything that is not a positive whole number. */
export function personIdParam(value: string | undefined): number {
  const id = parseRouteId(value);
  if (id === null) throw new HttpError(404, 'not_found', 'No such person in this household.');
  return id;
}
