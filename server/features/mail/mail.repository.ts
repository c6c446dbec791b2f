import { CaughtMail, MailDelivery } from '@server/db/models';

export const newestCaughtMail = (limit: number) => CaughtMail.findAll({ order: [['id', 'DESC']], limit });

export const newestDeliveries = (limit: number) => MailDelivery.findAll({ order: [['id', 'DESC']], limit });
