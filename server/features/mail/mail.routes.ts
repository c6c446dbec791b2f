import { Router } from 'express';
import { z } from 'zod';
import type { CaughtMailItem } from '@shared/schemas/mail';
import { CaughtMail, MailDelivery } from '@server/db/models';
import { requireRole } from '@server/middleware/session-guard';

const limitSchema = z.coerce.number().int().min(1).max(500).default(100);

export function mailRoutes(): Router {
  const router = Router();
  // What the local fake SMTP server caught: the demo's view of what would have been sent.
  router.get('/mail/outbox', requireRole('engineering'), async (req, res) => {
    const rows = await CaughtMail.findAll({
      order: [['id', 'DESC']],
      limit: limitSchema.parse(req.query.limit),
    });
    res.json(
      rows.map((m): CaughtMailItem => ({
        id: m.id,
        to: m.recipients,
        subject: m.subject,
        text: m.text,
        receivedAt: m.receivedAt.toISOString(),
      })),
    );
  });
  // Every send the app attempted, with failures and their error, so a missed e-mail is visible.
  router.get('/mail/deliveries', requireRole('engineering'), async (req, res) => {
    const rows = await MailDelivery.findAll({
      order: [['id', 'DESC']],
      limit: limitSchema.parse(req.query.limit),
    });
    res.json(
      rows.map((d) => ({
        id: d.id,
        topic: d.topic,
        to: d.recipients,
        subject: d.subject,
        status: d.status,
        error: d.error,
        attempts: d.attempts,
        lastAttemptAt: d.lastAttemptAt?.toISOString() ?? null,
        createdAt: d.createdAt.toISOString(),
        sentAt: d.sentAt?.toISOString() ?? null,
      })),
    );
  });
  return router;
}
