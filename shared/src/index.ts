// Public API of the domain maths package. Each concept lives in its own file.
export * from './workflow/index';

// Dates as shown, and the studio locale that orders them on the forms.
export * from './calendar-date';
export * from './studio-locale';

// Sign-in rules shared by the forms and the server.
export * from './password-rule';

// Measures: exact lengths, reading, rounding and showing them.
export * from './errors';
export * from './measure';
export * from './parse-length';
export * from './format-length';
export * from './rounding';

// Cut sizes from finished sizes.
export * from './seam-allowance';
export * from './triangle-cut';
export * from './flying-geese';
export * from './strip-yield';

// Sizes and layouts.
export * from './bed-sizes';
export * from './cushion-cover';
export * from './shrinkage';
export * from './grid-layout';
export * from './on-point';
export * from './layout-suggest';

// Radial and foundation blocks.
export * from './wedge-block';
export * from './centre-circle';
export * from './foundation-block';

// Studio fabric.
export * from './fabric-width';
export * from './shop-increment';
export * from './yardage';
export * from './binding';
export * from './backing';
export * from './wadding';

// The cut planner.
export * from './cut-plan/index';
export * from './money/quote-totals';

// A commission's design: derivation, drawing and its cut plan.
export * from './design/index';
export * from './money/quote-suggestion';
export * from './money/material-pricing';
export * from './money/labour-learning';

// The printouts: one content model each, drawn by the print page and the PDF.
export * from './printouts/index';
