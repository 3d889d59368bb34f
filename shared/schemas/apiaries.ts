import { z } from 'zod';
import type { Role } from '../domain/access';
import { HEMISPHERES } from '../domain/hives';
import { optionalNote, shortText } from './common';

export const apiaryCreateSchema = z.object({
  name: shortText('The apiary name', 80),
  hemisphere: z.enum(HEMISPHERES, { message: 'Choose north or south for the hemisphere.' }).default('north'),
  climateNote: optionalNote(300).default(''),
  winterStoresTargetKg: z
    .number({ message: 'The winter stores target must be a number of kilograms.' })
    .min(0, { message: 'The winter stores target cannot be negative.' })
    .max(150, { message: 'The winter stores target must be 150 kg or less.' })
    .default(20),
});
export type ApiaryCreateInput = z.input<typeof apiaryCreateSchema>;

export const apiaryUpdateSchema = z
  .object({
    name: shortText('The apiary name', 80),
    hemisphere: z.enum(HEMISPHERES, { message: 'Choose north or south for the hemisphere.' }),
    climateNote: optionalNote(300),
    winterStoresTargetKg: z
      .number({ message: 'The winter stores target must be a number of kilograms.' })
      .min(0, { message: 'The winter stores target cannot be negative.' })
      .max(150, { message: 'The winter stores target must be 150 kg or less.' }),
  })
  .partial()
  .strict();
export type ApiaryUpdateInput = z.infer<typeof apiaryUpdateSchema>;

export interface ApiaryDto {
  id: string;
  name: string;
  hemisphere: (typeof HEMISPHERES)[number];
  climateNote: string;
  winterStoresTargetKg: number;
  /** The signed-in person's role and window here. */
  myRole: Role;
  myStartsAt: string | null;
  myEndsAt: string | null;
  hiveCount: number;
  createdAt: string;
  updatedAt: string;
}
