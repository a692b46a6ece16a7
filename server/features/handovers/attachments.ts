// Photos and PDFs on handover items: the file's own bytes must say what it is (signature check);
// a renamed executable or script is refused whatever its name says.
import { randomUUID } from 'node:crypto';
import { Router } from 'express';
import multer from 'multer';
import { fileTypeFromBuffer } from 'file-type';
import { authorize, signedIn } from '../../lib/auth';
import { Conflict, Forbidden, NotFound, ValidationError } from '../../lib/errors';
import type { RealtimeHub } from '../../lib/realtime';
import type { Storage } from '../../lib/storage';
import { parseId } from '../../lib/validate';
import { Handover, HandoverAttachment, HandoverItem } from './model';

export const MAX_ATTACHMENT_BYTES = 10 * 1024 * 1024;
const allowed = new Set(['image/jpeg', 'image/png', 'image/webp', 'application/pdf']);
const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: MAX_ATTACHMENT_BYTES, files: 1 } });

export function attachmentRoutes(storage: Storage, realtime: RealtimeHub): Router {
  const router = Router();

  router.post('/handover-items/:id/attachments', authorize(['operator', 'shift_lead']), upload.single('file'), async (req, res) => {
    const item = await HandoverItem.findByPk(parseId(req.params.id));
    if (!item) throw new NotFound('That handover item');
    const handover = (await Handover.findByPk(item.handoverId))!;
    if (req.user!.crewId !== handover.outgoingCrewId) throw new Forbidden('Only the outgoing crew adds files to its handover');
    if (handover.status === 'accepted') throw new Conflict('The handover is accepted');
    if (!req.file) throw new ValidationError({ file: 'Choose a photo or PDF' });
    const detected = await fileTypeFromBuffer(req.file.buffer);
    if (!detected || !allowed.has(detected.mime)) {
      throw new ValidationError({ file: 'Only photos (JPEG, PNG, WebP) and PDF files; this file’s contents are something else' });
    }
    const storageKey = `handovers/${handover.id}/${randomUUID()}.${detected.ext}`;
    await storage.put(storageKey, req.file.buffer, detected.mime);
    const attachment = await HandoverAttachment.create({
      itemId: item.id,
      fileName: req.file.originalname.replace(/[^\w.\- ]/g, '_').slice(0, 200),
      mime: detected.mime,
      size: req.file.size,
      storageKey,
      uploadedBy: req.user!.id,
      uploadedAt: new Date(),
    });
    realtime.toUnit(handover.unitId, { entity: 'handover', id: handover.id });
    res.status(201).json({ id: attachment.id, mime: attachment.mime, fileName: attachment.fileName });
  });

  router.get('/attachments/:id', signedIn, async (req, res) => {
    const attachment = await HandoverAttachment.findByPk(parseId(req.params.id));
    if (!attachment) throw new NotFound('That file');
    const bytes = await storage.get(attachment.storageKey);
    res.setHeader('Content-Type', attachment.mime);
    res.setHeader('Content-Disposition', `inline; filename="${attachment.fileName}"`);
    res.send(bytes);
  });

  return router;
}
