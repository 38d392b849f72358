import { HarnessLoader } from '@angular/cdk/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';

/** A form's fields found by their labels through Material's harnesses; the loader is read when a field is looked up. */
export function labelledFields(loader: () => HarnessLoader) {
  const field = (label: string) => loader().getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
  return {
    field,
    input: async (label: string) => (await (await field(label)).getControl(MatInputHarness))!,
    select: async (label: string) => (await (await field(label)).getControl(MatSelectHarness))!,
  };
}
