// Photos and PDFs on handover items. The file's own bytes must say what it is (signature check); a
// renamed executable or script is refused whatever its name says. On a draft a file is simply added;
// after submit it is an amendment of its item (with a reason), so the item must be acknowledged again.
import { randomUUID } from 'node:crypto';
import { QueryTypes, type Sequelize } from 'sequelize';
import { fileTypeFromBuffer } from 'file-type';
import { mayWriteHandover } from '../../../shared/policies/handover';
import { Conflict, Forbidden, NotFound, ValidationError } from '../../lib/errors';
import { publish } from '../../lib/live';
import type { Storage } from '../../lib/storage';
import { unitOfWork } from '../../lib/unit-of-work';
import { itemWithHandover, lockedHandoverStatus, type HandoverService } from '../handovers/index';
import { HandoverAttachment } from './model';

export const MAX_ATTACHMENT_BYTES = 10 * 1024 * 1024;
export const MAX_FILES_PER_ITEM = 10;
export const MAX_BYTES_PER_HANDOVER = 100 * 1024 * 1024;
const allowed = new Set(['image/jpeg', 'image/png', 'image/webp', 'application/pdf']);

type Upload = { originalname: string; buffer: Buffer; size: number };

export function makeAttachmentService(sequelize: Sequelize, storage: Storage, handovers: HandoverService) {
  async function add(actor: Express.User, itemId: number, file: Upload | undefined, reason: string | undefined) {
    const { handover } = await itemWithHandover(itemId);
    if (!mayWriteHandover(actor, handover)) throw new Forbidden('Only the outgoing crew’s operators and shift lead add files to its handover');
    if (!file) throw new ValidationError({ file: 'Choose a photo or PDF' });
    if (handover.status !== 'draft' && !reason) throw new ValidationError({ reason: 'The handover is submitted: say why the file is added now (it is an amendment)' });
    const detected = await fileTypeFromBuffer(file.buffer);
    if (!detected || !allowed.has(detected.mime)) {
      throw new ValidationError({ file: 'Only photos (JPEG, PNG, WebP) and PDF files; this file’s contents are something else' });
    }
    const [onItem, onHandover] = await Promise.all([
      HandoverAttachment.count({ where: { itemId } }),
      sequelize.query<{ total: string | null }>(
        'SELECT SUM(a.size) AS total FROM handover_attachments a JOIN handover_items i ON i.id = a.item_id WHERE i.handover_id = ?',
        { replacements: [handover.id], plain: true, type: QueryTypes.SELECT },
      ),
    ]);
    if (onItem >= MAX_FILES_PER_ITEM) throw new ValidationError({ file: `An item holds at most ${MAX_FILES_PER_ITEM} files` });
    if (Number(onHandover?.total ?? 0) + file.size > MAX_BYTES_PER_HANDOVER) throw new ValidationError({ file: 'This handover’s files would pass 100 MB; link to the document instead' });
    const fileName = file.originalname.replace(/[^\w.\- ]/g, '_').slice(0, 200) || `file.${detected.ext}`;
    const storageKey = `handovers/${handover.id}/${randomUUID()}.${detected.ext}`;
    // The bytes first: a record never points at a file that is not there (an unused file is harmless).
    await storage.put(storageKey, file.buffer, detected.mime);
    return unitOfWork(sequelize, async (transaction) => {
      const status = await lockedHandoverStatus(handover.id, transaction);
      if (status !== handover.status) throw new Conflict('The handover was submitted meanwhile; add the file again with a reason');
      const amendment =
        status === 'draft' ? null : await handovers.amend(actor, handover.id, { itemId, reason: reason!, text: `Added the file “${fileName}”.` }, transaction);
      const attachment = await HandoverAttachment.create(
        { itemId, fileName, mime: detected.mime, size: file.size, storageKey, uploadedBy: actor.id, uploadedAt: new Date(), amendmentId: amendment?.id ?? null },
        { transaction },
      );
      publish(transaction, { entity: 'handover', id: handover.id, unitId: handover.unitId });
      return attachment;
    });
  }

  async function read(id: number) {
    const attachment = await HandoverAttachment.findByPk(id);
    if (!attachment) throw new NotFound('That file');
    return { attachment, bytes: await storage.get(attachment.storageKey) };
  }

  return { add, read };
}
export type AttachmentService = ReturnType<typeof makeAttachmentService>;

/** The files on these items, oldest first (the board lists them under each item). */
export function attachmentsOfItems(itemIds: number[]) {
  return itemIds.length ? HandoverAttachment.findAll({ where: { itemId: itemIds }, order: [['id', 'ASC']] }) : Promise.resolve([]);
}
