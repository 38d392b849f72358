import { Model, type Pojo } from 'objection';
import { upgradeStoredDesign, type DesignBody, type DesignDerivation, type DesignPlanSummary, type StoredDesignBody } from '@keepstitch/shared';

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

  /** A version saved before designs listed their groups of garments is read with the list, as if saved today. */
  override $parseDatabaseJson(json: Pojo): Pojo {
    const row = super.$parseDatabaseJson(json);
    if (row['body']) {
      const { body, derived } = upgradeStoredDesign(row['body'] as StoredDesignBody, row['derived'] as DesignDerivation | undefined);
      row['body'] = body;
      if (derived) row['derived'] = derived;
    }
    return row;
  }
}
