import { AbstractControl, FormGroup } from '@angular/forms';

/**
 * Puts the server's per-field messages onto the matching controls as a
 * `server` error, so each shows under its own field. The error clears itself
 * as soon as the person edits that field. Returns the messages that matched
 * no control, for showing above the form.
 */
export function applyServerFieldErrors<T extends Record<string, AbstractControl>>(
  form: FormGroup<T>,
  fields: Record<string, string> | undefined,
): string[] {
  const unmatched: string[] = [];
  for (const [name, message] of Object.entries(fields ?? {})) {
    const control: AbstractControl | null = form.get(name);
    if (control) {
      control.setErrors({ ...control.errors, server: message });
      control.markAsTouched();
    } else {
      unmatched.push(message);
    }
  }
  return unmatched;
}
