import { Router } from 'express';
import { z } from 'zod';
import { requireRole, actor } from '../middleware/access.ts';
import { parse } from '../middleware/validate.ts';
import { getMessage, getAttachment, listMessages } from '../services/mailbox.ts';

/** The local mail catcher's messages to the admin's own organisation, while no real SMTP server is configured. */
export const mailboxRouter = Router();
const messageNumber = { error: 'That message number is not valid.' };
const idParam = z.object({ id: z.coerce.number(messageNumber).int(messageNumber).positive(messageNumber) });

mailboxRouter.use(requireRole('admin'));

mailboxRouter.get('/', async (req, res) => {
  res.json({ messages: await listMessages(actor(req).organisationId) });
});

mailboxRouter.get('/:id', async (req, res) => {
  res.json({ message: await getMessage(actor(req).organisationId, parse(idParam, req.params).id) });
});

mailboxRouter.get('/:id/attachments/:index', async (req, res) => {
  const { id, index } = parse(idParam.extend({ index: z.coerce.number({ error: 'That attachment number is not valid.' }).int({ error: 'That attachment number is not valid.' }).min(0, { error: 'That attachment number is not valid.' }) }), req.params);
  const attachment = await getAttachment(actor(req).organisationId, id, index);
  res.setHeader('Content-Type', attachment.contentType);
  res.setHeader('Content-Disposition', `attachment; filename="${attachment.filename.replace(/[^\w.-]/g, '_')}"`);
  res.send(attachment.content);
});
