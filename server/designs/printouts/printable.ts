import type { CommissionModel } from '../../models/commission-model';
import type { DesignVersionModel } from '../../models/design-model';
import type { DesignSources } from '@keepstitch/shared';

export interface PrintableDesign {
  commission: CommissionModel;
  version: DesignVersionModel;
  sources: DesignSources;
  /** The fabric legend: a group of garments carries the stripes it is drawn in. */
  fabrics: { key: string; name: string; hex: string; stripes?: string[] }[];
}
