export {
  ACCEPT_ATTRIBUTE,
  ACCEPTED_TYPES,
  formatBytes,
  isImageType,
  MAX_CAPTION_LENGTH,
  MAX_FILE_BYTES,
  MAX_FILES_PER_CASE,
  MAX_FILES_PER_REQUEST,
  MAX_NAME_LENGTH,
  MAX_REQUEST_BYTES,
  THUMBNAIL_WIDTH,
  type AcceptedType,
} from './limits';
export { contentDisposition, extensionOf, sanitiseFileName } from './names';
export { detectFileType, isPlainText, type Detection } from './detect';
export { makeThumbnail } from './thumbnail';
export { checkUpload, type RefusedFile } from './intake';
export { ATTACHMENT_FAILURES, type AttachmentFailure } from './messages';
export { CaptionSchema, ListAttachmentsQuery, UpdateAttachmentSchema } from './validation';
export {
  addAttachments,
  attachmentsOfRevision,
  canChangeAttachments,
  captionAttachment,
  findAttachmentFile,
  findWorkingRevision,
  listAttachments,
  removeAttachment,
  workingRevision,
  type AttachmentView,
  type CheckedFile,
} from './services';
