import type { CreationAttributes } from 'sequelize';
import { Photo } from '@server/db/models';

export const insertPhoto = (row: CreationAttributes<Photo>) => Photo.create(row);

export const photoById = (id: string) => Photo.findByPk(id);
