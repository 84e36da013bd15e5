/**
 * How a household crop is named wherever it is shown: the harvest list, the share report's top
 * crops, the larder, plantings, imports and messages. The SQL twin for reads that name harvests
 * in the database is harvestNameSql (src/server/harvest-sql.ts); a test holds the two together.
 */

/** "Name (variety)", or the name alone. Example: `cropDisplayName('Potato', 'Pink Fir')` → 'Potato (Pink Fir)' */
export function cropDisplayName(name: string, variety: string | null | undefined): string {
  return variety ? `${name} (${variety})` : name;
}
