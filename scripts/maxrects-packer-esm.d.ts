// Under Node 20 the benchmark loads maxrects-packer's ES module build directly; it has the package's own types.
declare module 'maxrects-packer/dist/maxrects-packer.mjs' {
  export * from 'maxrects-packer/dist/index';
}
