/**
 * Selfsown's own icons, drawn for it on a 24 × 24 grid with round 2 px strokes in the current text
 * colour: the plate whose share is home-grown (the mark), the larder jar full and empty, the
 * kitchen scale, the year's ring of months, a caution mark and the plant label that marks a
 * pinned crop. Kept as data so the static
 * (Icon.astro) and the island (Icon.tsx) versions draw exactly the same shapes.
 */

export interface IconShape {
  /** Stroked paths (no fill). */
  strokes: string[];
  /** Filled paths, in the current colour. */
  fills?: string[];
}

export const ICONS = {
  /** A plate seen from above; the filled wedge is the share from home. */
  plate: {
    strokes: ['M12 2.5a9.5 9.5 0 1 1 0 19a9.5 9.5 0 1 1 0-19z'],
    fills: ['M12 12V5.5a6.5 6.5 0 1 1-6.1 8.7z'],
  },
  /** A preserving jar with its lid and a level of food inside. */
  jar: {
    strokes: ['M8 3h8v3H8z', 'M7 6h10a1 1 0 0 1 1 1v12a2 2 0 0 1-2 2H8a2 2 0 0 1-2-2V7a1 1 0 0 1 1-1z'],
    fills: ['M8 11h8v7.5a.5.5 0 0 1-.5.5h-7a.5.5 0 0 1-.5-.5z'],
  },
  /** The same jar with nothing in it. */
  'jar-empty': {
    strokes: ['M8 3h8v3H8z', 'M7 6h10a1 1 0 0 1 1 1v12a2 2 0 0 1-2 2H8a2 2 0 0 1-2-2V7a1 1 0 0 1 1-1z', 'M9.5 14.5h5'],
  },
  /** A kitchen scale: pan, column and dial. */
  scale: {
    strokes: ['M4 8h16', 'M6 8a6 3 0 0 0 12 0', 'M12 11v4', 'M6 21h12l-1.5-6h-9z'],
  },
  /** The year as a ring of twelve months, one of them marked. */
  ring: {
    strokes: ['M12 3a9 9 0 1 1 0 18a9 9 0 1 1 0-18z', 'M12 7a5 5 0 1 1 0 10a5 5 0 1 1 0-10z'],
    fills: ['M12 3a9 9 0 0 1 4.5 1.2L14.5 7.7A5 5 0 0 0 12 7z'],
  },
  /** A caution: an exclamation in a rounded square. */
  caution: {
    strokes: ['M5 3h14a2 2 0 0 1 2 2v14a2 2 0 0 1-2 2H5a2 2 0 0 1-2-2V5a2 2 0 0 1 2-2z', 'M12 7v6'],
    fills: ['M12 15.5a1.25 1.25 0 1 1 0 2.5a1.25 1.25 0 1 1 0-2.5z'],
  },
  /** A plant label on its stake, as pushed into a bed: a crop pinned to the front. */
  stake: {
    strokes: ['M6 3h12v7l-6 3l-6-3z', 'M12 13v8'],
    fills: ['M9 6h6v2H9z'],
  },
} as const satisfies Record<string, IconShape>;

export type IconName = keyof typeof ICONS;
