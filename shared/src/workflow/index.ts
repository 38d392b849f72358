export * from './commission-stages';
export * from './garment-custody';
export * from './vocabulary';
export * from './cautions';
export * from './text-limits';
export * from './delivery';
