/**
 * The longest text the server keeps in each field, in characters: the one
 * place a form's validator (and its maxlength) and the server's zod schema
 * take their limits from, so the two cannot drift apart.
 */

export const GARMENT_TEXT_LIMITS = { description: 300, whose: 200, story: 5000, colour: 100, condition: 2000, returnsToClient: 1000 } as const;

/** A garment's kept features: characters of a position, features a garment. */
export const KEPT_FEATURE_LIMITS = { position: 200, features: 20 } as const;

/** A commission's own words, a stage move's note and an hours entry's note; `filter` is the list's search text. */
export const COMMISSION_TEXT_LIMITS = { title: 200, recipient: 200, occasion: 200, sizePreset: 60, notes: 5000, moveNote: 1000, hoursNote: 1000, filter: 200 } as const;

/** A custody entry: where it is kept, a tracking reference, a note. */
export const CUSTODY_TEXT_LIMITS = { place: 60, trackingRef: 60, note: 1000 } as const;

/** A client record; `filter` is the list's search text. */
export const CLIENT_TEXT_LIMITS = { name: 200, email: 254, phone: 40, address: 1000, notes: 5000, filter: 200 } as const;

/** A person who signs in. */
export const USER_TEXT_LIMITS = { name: 200, email: 254 } as const;

/** A measured panel of a garment and a kept feature marked on it. */
export const PANEL_TEXT_LIMITS = { name: 60, featureName: 60 } as const;

/** A studio fabric on the shelf. */
export const STOCK_TEXT_LIMITS = { name: 200, colour: 100, supplier: 300, notes: 2000 } as const;

/** A quote, its lines, and the client's answer to it. */
export const QUOTE_TEXT_LIMITS = { intro: 2000, lineDescription: 300, lineUnit: 20, acceptName: 200, declineNote: 2000 } as const;

/** The studio's own details in Settings. */
export const SETTINGS_TEXT_LIMITS = { studioName: 200, makerName: 200, address: 1000, email: 254, vatNumber: 20, paymentTerms: 2000 } as const;

/** A design: a block kind's name, the note saved with a version, the client's answer to a shared drawing, a bed preset's name. */
export const DESIGN_TEXT_LIMITS = { blockName: 100, versionNote: 1000, responseNote: 2000, preset: 60 } as const;

/** A payment recorded by hand (cash or bank transfer): its reference, and the note given when it is undone. */
export const PAYMENT_TEXT_LIMITS = { reference: 100, undoNote: 1000 } as const;

/** A photo's caption: the note a client or the studio sends with it. */
export const PHOTO_TEXT_LIMITS = { caption: 500 } as const;
