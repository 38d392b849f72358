import { Model } from 'objection';

export class PhotoModel extends Model {
  static override tableName = 'photos';
  id!: number;
  commissionId!: number;
  garmentId!: number | null;
  kind!: 'garment' | 'progress';
  fileName!: string;
  thumbName!: string;
  originalName!: string | null;
  mime!: string;
  width!: number;
  height!: number;
  bytes!: number;
  caption!: string | null;
  uploadedBy!: number | null;
  createdAt!: Date;

  /** What the API shows of a photo: its links, never the stored file names. */
  toPublic() {
    return {
      id: this.id,
      garmentId: this.garmentId,
      kind: this.kind,
      originalName: this.originalName,
      width: this.width,
      height: this.height,
      caption: this.caption,
      createdAt: this.createdAt,
      url: `/api/photos/${this.id}/image`,
      thumbUrl: `/api/photos/${this.id}/thumb`,
    };
  }
}
