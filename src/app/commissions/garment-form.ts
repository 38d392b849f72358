import { signal } from '@angular/core';
import { FormArray, FormControl, FormGroup, Validators } from '@angular/forms';
import { COLOUR_RUN, CONSTRUCTION, ColourRun, Construction, FIBRE, Fibre, GARMENT_TEXT_LIMITS, PREWASH, PRINT, Prewash, Print } from '@keepstitch/shared';
import type { Observable } from 'rxjs';

import { apiErrorOf, messageFor } from '../core/api-error';
import { applyServerFieldErrors } from '../ui/server-field-errors';
import { GarmentDetail, GarmentDraft, orNull } from './commission';
import { KeptFeatureForm } from './kept-feature-form';

const text = (limit: number, required = false) =>
  new FormControl('', { nonNullable: true, validators: required ? [Validators.required, Validators.maxLength(limit)] : [Validators.maxLength(limit)] });

/**
 * Every field of a garment as a form control, with the server's text limits.
 * The intake steps, the details form and the client's portal each build their
 * form from these (the portal takes a few), so a field and its limit are
 * written once.
 */
export function garmentControls() {
  return {
    description: text(GARMENT_TEXT_LIMITS.description, true),
    whose: text(GARMENT_TEXT_LIMITS.whose),
    story: text(GARMENT_TEXT_LIMITS.story),
    colour: text(GARMENT_TEXT_LIMITS.colour),
    print: new FormControl<Print | null>(null),
    fibre: new FormControl<Fibre | null>(null),
    construction: new FormControl<Construction | null>(null),
    condition: text(GARMENT_TEXT_LIMITS.condition),
    prewash: new FormControl<Prewash | null>(null),
    colourRun: new FormControl<ColourRun | null>(null),
    returnsToClient: text(GARMENT_TEXT_LIMITS.returnsToClient),
  };
}

export type GarmentControls = ReturnType<typeof garmentControls>;

/** What each choice field offers, in order, for a select. */
export const GARMENT_CHOICES = {
  fibres: FIBRE.options,
  constructions: CONSTRUCTION.options,
  prints: PRINT.options,
  prewashes: PREWASH.options,
  colourRuns: COLOUR_RUN.options,
} as const;
export type GarmentField = keyof GarmentControls;
/** The typed values of some of a garment's controls. */
export type GarmentValues = { [K in GarmentField]?: GarmentControls[K]['value'] };

/** The free-text fields: trimmed, and sent as null when left empty (but the description, which is required). */
export const GARMENT_TEXT_FIELDS = ['description', 'whose', 'story', 'colour', 'condition', 'returnsToClient'] as const;
/** The fields chosen from a list. */
export const GARMENT_CHOICE_FIELDS = ['fibre', 'construction', 'print', 'prewash', 'colourRun'] as const;

/** The controls named, from a fresh set, for a form of only those fields. */
export function someGarmentControls<K extends GarmentField>(fields: readonly K[]): Pick<GarmentControls, K> {
  const all = garmentControls();
  return Object.fromEntries(fields.map((f) => [f, all[f]])) as Pick<GarmentControls, K>;
}

/** A garment's stored values as the controls hold them (empty text for none). */
export function garmentFormValues(g: GarmentDetail): Required<GarmentValues> {
  return {
    description: g.description,
    whose: g.whose ?? '',
    story: g.story ?? '',
    colour: g.colour ?? '',
    print: g.print ?? null,
    fibre: g.fibre ?? null,
    construction: g.construction ?? null,
    condition: g.condition ?? '',
    prewash: g.prewash ?? null,
    colourRun: g.colourRun ?? null,
    returnsToClient: g.returnsToClient ?? '',
  };
}

/** The kept features as typed, positions trimmed. */
export function keptFeaturesFrom(features: FormArray<KeptFeatureForm>): NonNullable<GarmentDraft['features']> {
  return features.getRawValue().map((f) => ({ kind: f.kind, position: f.position.trim() }));
}

/** A new garment from the values of whichever fields a form has. */
export function garmentDraft(values: GarmentValues, features?: GarmentDraft['features']): GarmentDraft {
  const draft: Partial<GarmentDraft> = {};
  const set = draft as Record<string, unknown>;
  for (const key of GARMENT_TEXT_FIELDS) if (key !== 'description' && key in values) set[key] = orNull(values[key]);
  for (const key of GARMENT_CHOICE_FIELDS) if (key in values) set[key] = values[key];
  if (features) draft.features = features;
  return { description: (values.description ?? '').trim(), ...draft };
}

/**
 * What changed against the garment as stored: only those fields are sent. A
 * choice left unset is not sent (once set, the server keeps it set).
 */
export function garmentChanges(g: GarmentDetail, values: Required<GarmentValues>, features: NonNullable<GarmentDraft['features']>): Partial<GarmentDraft> {
  const changes: Partial<GarmentDraft> = {};
  const set = changes as Record<string, unknown>;
  for (const key of GARMENT_TEXT_FIELDS) {
    const now = key === 'description' ? values.description.trim() : orNull(values[key]);
    const before = key === 'description' ? g.description : orNull(g[key]);
    if (now !== before) set[key] = now;
  }
  for (const key of GARMENT_CHOICE_FIELDS) {
    const now = values[key];
    if (now !== null && now !== (g[key] ?? null)) set[key] = now;
  }
  const before = (g.features ?? []).map((f) => ({ kind: f.kind, position: f.position }));
  if (JSON.stringify(features) !== JSON.stringify(before)) changes.features = features;
  return changes;
}

/**
 * Sending a garment form: while it goes, `saving`; when refused, the server's
 * field messages go under their fields and `error` says what happened (with
 * any message no field of these forms could show).
 */
export class GarmentSave {
  readonly saving = signal(false);
  readonly error = signal<string | null>(null);

  /** `fieldsSpeakForThemselves`: no message above the form when every refusal shows under its field (the form is short). */
  constructor(private readonly fieldsSpeakForThemselves = false) {}

  send(request: Observable<GarmentDetail>, forms: readonly FormGroup[], saved: (garment: GarmentDetail) => void): void {
    this.saving.set(true);
    this.error.set(null);
    request.subscribe({
      next: (garment) => {
        this.saving.set(false);
        saved(garment);
      },
      error: (error: unknown) => {
        this.saving.set(false);
        const fields = apiErrorOf(error)?.fields;
        // A message matched by no control of any of the forms is said above them.
        const unmatched = Object.entries(fields ?? {})
          .filter(([name]) => !forms.some((f) => f.get(name)))
          .map(([, message]) => message);
        for (const form of forms) applyServerFieldErrors(form, Object.fromEntries(Object.entries(fields ?? {}).filter(([name]) => form.get(name))));
        this.error.set(this.fieldsSpeakForThemselves && fields && !unmatched.length ? null : [messageFor(error), ...unmatched].join(' '));
      },
    });
  }
}
