// The attachments feature as other features see it: import from here, never from its files.
export { attachmentsOfItems } from './service';
