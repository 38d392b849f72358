import type { Model } from 'objection';
import { present } from '../core/field-policy';
import type { GarmentModel } from '../models/garment-model';

/** The fields of a garment each role may see (a client sees its own words and the basics). */
export function garmentView(g: GarmentModel, user: Express.User) {
  return present('garment', user.role, g.toJSON() as Omit<GarmentModel, keyof Model>);
}
