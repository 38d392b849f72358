export * from './printout-content';
export * from './printable-design';
export * from './printouts';
export * from './cut-list-printout';
export * from './templates-printout';
export * from './care-card-printout';
export * from './template-outline';
