import { Model } from 'objection';
import type { DesignBody, DesignDerivation, DesignPlanSummary } from '@keepstitch/shared';

export type ClientResponse = 'approved' | 'changes_requested';

export class DesignVersionModel extends Model {
  static override tableName = 'designVersions';

  id!: number;
  commissionId!: number;
  version!: number;
  body!: DesignBody;
  derived!: DesignDerivation;
  plan!: DesignPlanSummary;
  note!: string | null;
  createdBy!: number | null;
  createdAt!: Date;
  sharedAt!: Date | null;
  clientResponse!: ClientResponse | null;
  clientNote!: string | null;
  respondedAt!: Date | null;

  static override get jsonAttributes() {
    return ['body', 'derived', 'plan'];
  }
}
