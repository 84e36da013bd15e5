/**
 * The monthly letter in words: subject, plain text and a simple HTML body (inline styles only, as
 * mail programs drop style sheets), in Selfsown's own wording and colours. Everything it says comes
 * from a LetterData (letter-content.ts); numbers go through format-number.ts and the dashboard's
 * percentText, weights through formatWeight, and every piece of text placed in HTML is escaped.
 */
import { M2_PER_FT2 } from './bed-schemas';
import { CAUTIONS } from './cautions';
import { formatAmount } from './format-number';
import { escapeHtml } from './html-escape';
import type { LetterData, LetterShare } from './letter-content';
import { formatDate, formatMonthText } from './format-date';
import { PALETTE } from './palette';
import { percentText } from './share-scale';
import { formatWeight } from './units';

export interface LetterText {
  subject: string;
  text: string;
  html: string;
}

/** Example: `monthText('2026-11')` → 'November 2026' */
export function monthText(month: string): string {
  return formatMonthText(month, 'long');
}

/** A day as every page writes it (src/lib/format-date.ts). Example: `dayText('2027-03-14')` → '14 Mar 2027' */
export function dayText(date: string): string {
  return formatDate(date);
}

/** An area in m², with square feet beside it for a household on US units. Example: `areaText(2.5, 'us')` → '2.5 m² (26.9 ft²)' */
export function areaText(m2: number, units: LetterData['units']): string {
  const metric = `${formatAmount(m2)} m²`;
  return units === 'us' ? `${metric} (${formatAmount(m2 / M2_PER_FT2)} ft²)` : metric;
}

const pct = (share: number | null, uncertain = false) => {
  const t = percentText(share);
  return uncertain && t !== '–' ? `${t} (uncertain: some of it has no value)` : t;
};

/** One line on the home share of energy or protein. */
function shareLine(label: string, s: LetterShare): string {
  const intake = s.shareOfIntake === null ? 'no share of what you ate could be worked out' : `${pct(s.shareOfIntake, s.uncertain)} of what you ate was home-grown`;
  const need = s.shareOfNeed === null ? '' : `; that is ${pct(s.shareOfNeed)} of what the household needs`;
  return `${label}: ${intake}${need}.`;
}

interface Section {
  title: string;
  lines: string[];
  /** A closing sentence under the list. */
  note?: string;
}

/** The letter's sections, in order, as plain lines (shared by the text and the HTML body). */
function sections(d: LetterData): Section[] {
  const month = monthText(d.month);
  const out: Section[] = [];
  out.push({ title: `Your own ground in ${month}`, lines: [shareLine('Calories', d.energy), shareLine('Protein', d.protein)] });

  if (d.gapState === 'gaps') {
    out.push({
      title: 'Furthest from need',
      lines: d.gaps.map((g) => `${g.name}: ${percentText(g.shareOfNeed)} of the recommended intake from the garden (${formatAmount(g.home)} of ${formatAmount(g.need)} ${g.unit}, ${formatAmount(g.shortfall)} ${g.unit} short).`),
    });
  } else if (d.gapState === 'none') {
    out.push({ title: 'No gaps', lines: [`No gaps in ${month}: the garden met the recommended intake of every nutrient Selfsown follows for your household.`] });
  } else {
    out.push({
      title: 'Gaps',
      lines: [`No need could be worked out for ${month}. Add the people who eat at home on the People page, and the letter will say how far the garden went toward what they need.`],
    });
  }

  out.push(
    d.crops.length > 0
      ? {
          title: 'The crops that did most',
          lines: d.crops.map((c) => {
            const parts = [c.energyKcal !== null ? `${formatAmount(c.energyKcal)} kcal` : 'energy unknown', c.proteinG !== null ? `${formatAmount(c.proteinG)} g protein` : 'protein unknown'];
            const share = c.shareOfHomeEnergy !== null ? ` (${percentText(c.shareOfHomeEnergy)} of the home-grown calories)` : '';
            return `${c.name}: ${parts.join(', ')}${share}.`;
          }),
        }
      : { title: 'The crops that did most', lines: [`Nothing home-grown was eaten in ${month}.`] },
  );

  const l = d.larder;
  if (l.stores.length === 0) {
    out.push({ title: 'In the larder', lines: [`Nothing is recorded in store on ${dayText(l.today)}.`] });
  } else {
    const more = l.moreStores > 0 ? ` And ${l.moreStores} more in store.` : '';
    const empty = l.firstEmptyMonth ? ` At the present rate nothing stored is left to eat in ${monthText(l.firstEmptyMonth)}.` : '';
    out.push({
      title: `In the larder on ${dayText(l.today)}`,
      lines: l.stores.map((s) => `${s.label}: ${formatWeight(s.remainingGrams, d.units)}, runs out about ${dayText(s.runsOut)}.`),
      note: `${formatWeight(l.totalGrams, d.units)} in store altogether.${more}${empty}`,
    });
  }

  const s = d.suggestion;
  out.push(
    s
      ? {
          title: 'One idea from the gap finder',
          lines: [
            `${s.nutrient} is furthest behind this growing year (${formatAmount(s.shortfall)} ${s.unit} short so far). The crop that gives the most of it per square metre is ${s.crop}: about ${areaText(s.areaM2, d.units)} would cover that, by ${s.yieldSource === 'own' ? 'your own measured yield' : 'a typical reference yield'}.`,
          ],
        }
      : { title: 'One idea from the gap finder', lines: ['The gap finder has nothing to suggest: no nutrient has fallen short so far this growing year, or no need is known yet.'] },
  );
  return out;
}

/** The subject line: household, month and, when known, the home share of calories. */
export function letterSubject(d: LetterData): string {
  const share = d.energy.shareOfIntake === null ? 'from your own ground' : `${percentText(d.energy.shareOfIntake)} of calories home-grown`;
  return `${d.householdName} · ${monthText(d.month)}: ${share}`;
}

const FOOTER_WHY = (name: string) => `You get this letter because you are a member of ${name} and the monthly letter is on.`;

function plainText(d: LetterData, parts: Section[]): string {
  const lines = [`Selfsown · ${d.householdName} · ${monthText(d.month)}`, ''];
  for (const p of parts) {
    lines.push(p.title.toUpperCase(), ...p.lines.map((l) => `- ${l}`));
    if (p.note) lines.push(p.note);
    lines.push('');
  }
  lines.push(`The whole month, nutrient by nutrient: ${d.links.share}`, '', '--', CAUTIONS.medical, '', FOOTER_WHY(d.householdName));
  lines.push(`Stop the monthly letter (no sign-in needed): ${d.links.unsubscribe}`, `Or switch it on your account page: ${d.links.account}`);
  return `${lines.join('\n')}\n`;
}

// Selfsown's palette (src/styles/global.css): loam for text and rules, sprout for headings and links.
const C = { text: PALETTE['loam-900'], muted: PALETTE['loam-700'], rule: PALETTE['loam-200'], paper: PALETTE['loam-50'], green: PALETTE['sprout-700'], greenDark: PALETTE['sprout-900'] };

function htmlBody(d: LetterData, parts: Section[]): string {
  const e = escapeHtml;
  const link = (url: string, label: string) => `<a href="${e(url)}" style="color:${C.green}">${e(label)}</a>`;
  const blocks = parts.map(
    (p) =>
      `<h2 style="margin:24px 0 8px;font-size:18px;color:${C.greenDark}">${e(p.title)}</h2>` +
      `<ul style="margin:0;padding-left:20px">${p.lines.map((l) => `<li style="margin:4px 0">${e(l)}</li>`).join('')}</ul>` +
      (p.note ? `<p style="margin:8px 0 0">${e(p.note)}</p>` : ''),
  );
  return (
    `<div style="font-family:'Nunito Sans',Helvetica,Arial,sans-serif;max-width:36rem;margin:0 auto;padding:16px;color:${C.text};background:${C.paper};font-size:16px;line-height:1.5">` +
    `<p style="margin:0;font-size:14px;color:${C.muted}">Selfsown · ${e(d.householdName)}</p>` +
    `<h1 style="margin:4px 0 0;font-size:24px;color:${C.greenDark}">${e(monthText(d.month))}</h1>` +
    blocks.join('') +
    `<p style="margin:24px 0"><a href="${e(d.links.share)}" style="display:inline-block;padding:12px 20px;background:${C.green};color:#fff;border-radius:10px;text-decoration:none">See the whole month</a></p>` +
    `<div style="border-top:1px solid ${C.rule};padding-top:12px;font-size:13px;color:${C.muted}">` +
    `<p style="margin:0 0 8px">${e(CAUTIONS.medical)}</p>` +
    `<p style="margin:0">${e(FOOTER_WHY(d.householdName))} ${link(d.links.unsubscribe, 'Stop the monthly letter')} (no sign-in needed) or switch it on ${link(d.links.account, 'your account page')}.</p>` +
    `</div></div>`
  );
}

/** Subject, plain text and HTML of one monthly letter. */
export function letterText(d: LetterData): LetterText {
  const parts = sections(d);
  return { subject: letterSubject(d), text: plainText(d, parts), html: htmlBody(d, parts) };
}
