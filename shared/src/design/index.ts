export * from './design-body';
export * from './derive-design';
export * from './design-drawing';
export * from './plan-design';
export * from './fabric-colour';
export * from './garment-groups';
export * from './kept-feature-places';
export * from './cut-list-words';
