import { Model, type QueryBuilder } from 'objection';
import type { ColourRun, Construction, CustodyKind, Fibre, Grain, KeptFeature, PanelFeature, Prewash, Print, ReturnMethod } from '@keepstitch/shared';
import { PhotoModel } from './photo-model';

export class GarmentModel extends Model {
  static override tableName = 'garments';

  id!: number;
  commissionId!: number;
  description!: string;
  whose!: string | null;
  story!: string | null;
  fibre!: Fibre | null;
  construction!: Construction;
  colour!: string | null;
  print!: Print;
  condition!: string | null;
  features!: KeptFeature[];
  prewash!: Prewash;
  colourRun!: ColourRun;
  returnsToClient!: string | null;
  createdBy!: number | null;
  createdAt!: Date;
  updatedAt!: Date;

  panels?: PanelModel[];
  events?: CustodyEventModel[];
  photos?: PhotoModel[];

  static override get jsonAttributes() {
    return ['features'];
  }

  static override get relationMappings() {
    return {
      /** Its measured panels, in the order they were measured. */
      panels: {
        relation: Model.HasManyRelation,
        modelClass: PanelModel,
        join: { from: 'garments.id', to: 'panels.garmentId' },
        modify: (q: QueryBuilder<PanelModel>) => q.orderBy('panels.id'),
      },
      /** Its custody log, oldest first. */
      events: {
        relation: Model.HasManyRelation,
        modelClass: CustodyEventModel,
        join: { from: 'garments.id', to: 'custodyEvents.garmentId' },
        modify: (q: QueryBuilder<CustodyEventModel>) => q.orderBy('custodyEvents.at').orderBy('custodyEvents.id'),
      },
      photos: {
        relation: Model.HasManyRelation,
        modelClass: PhotoModel,
        join: { from: 'garments.id', to: 'photos.garmentId' },
        modify: (q: QueryBuilder<PhotoModel>) => q.orderBy('photos.id'),
      },
    };
  }

  override $beforeUpdate(): void {
    this.updatedAt = new Date();
  }
}

export class CustodyEventModel extends Model {
  static override tableName = 'custodyEvents';
  id!: number;
  garmentId!: number;
  kind!: CustodyKind;
  place!: string | null;
  returnMethod!: ReturnMethod | null;
  trackingRef!: string | null;
  note!: string | null;
  correctsEventId!: number | null;
  userId!: number | null;
  at!: Date;
}

export class PanelModel extends Model {
  static override tableName = 'panels';
  id!: number;
  garmentId!: number;
  name!: string;
  widthMm!: string;
  heightMm!: string;
  grain!: Grain;
  /** Kept features measured on the panel, in exact millimetres. */
  features!: PanelFeature[];
  createdAt!: Date;

  static override get jsonAttributes() {
    return ['features'];
  }
}
