import { Router } from 'express';
import { z } from 'zod';
import { requireRole, actor } from '../middleware/access.ts';
import { config } from '../config.ts';
import { notFound } from '../errors.ts';
import { parse } from '../middleware/validate.ts';
import { getMessage, getAttachment, listMessages } from '../services/mailbox.ts';

/** The local mail catcher's messages sent for the admin's own organisation, only while that catcher takes the app's mail. */
export const mailboxRouter = Router();
const messageNumber = { error: 'That message number is not valid.' };
const idParam = z.object({ id: z.coerce.number(messageNumber).int(messageNumber).positive(messageNumber) });

// With a real mail service the mailbox does not exist at all (checked per request, so a test can switch it).
mailboxRouter.use((_req, _res, next) => next(config.mailboxServed ? undefined : notFound('That API route')));
mailboxRouter.use(requireRole('admin'));

mailboxRouter.get('/', async (req, res) => {
  res.json({ messages: await listMessages(actor(req)) });
});

mailboxRouter.get('/:id', async (req, res) => {
  res.json({ message: await getMessage(actor(req), parse(idParam, req.params).id) });
});

mailboxRouter.get('/:id/attachments/:index', async (req, res) => {
  const { id, index } = parse(
    idParam.extend({
      index: z.coerce
        .number({ error: 'That attachment number is not valid.' })
        .int({ error: 'That attachment number is not valid.' })
        .min(0, { error: 'That attachment number is not valid.' }),
    }),
    req.params,
  );
  const attachment = await getAttachment(actor(req), id, index);
  res.setHeader('Content-Type', attachment.contentType);
  res.setHeader('Content-Disposition', `attachment; filename="${attachment.filename.replace(/[^\w.-]/g, '_')}"`);
  res.send(attachment.content);
});
