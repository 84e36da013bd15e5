/**
 * Whether a request's Accept-Encoding lets the answer go out gzip-compressed (RFC 9110 §12.5.3):
 * `gzip` (or its old alias `x-gzip`) listed with a weight above 0, or `*` above 0 with gzip not
 * refused by name. Weights are read as the RFC writes them (0 to 1, at most three decimals); a
 * coding written any other way is ignored, so an odd header only ever means "send it plain".
 * @example acceptsGzip('gzip, deflate, br') → true; acceptsGzip('gzip;q=0, *') → false; acceptsGzip(null) → false
 */
export function acceptsGzip(header: string | null | undefined): boolean {
  if (!header) return false;
  let named: number | null = null;
  let any: number | null = null;
  for (const part of header.split(',')) {
    const [codingText, ...params] = part.split(';');
    const coding = codingText!.trim().toLowerCase();
    let weight = 1;
    for (const p of params) {
      const m = /^\s*q\s*=\s*(0(?:\.\d{0,3})?|1(?:\.0{0,3})?)\s*$/i.exec(p);
      if (m) weight = Number(m[1]);
      else if (/^\s*q\s*=/i.test(p)) weight = NaN;
    }
    if (Number.isNaN(weight)) continue;
    if (coding === 'gzip' || coding === 'x-gzip') named = Math.max(named ?? 0, weight);
    else if (coding === '*') any = Math.max(any ?? 0, weight);
  }
  if (named !== null) return named > 0;
  return any !== null && any > 0;
}
