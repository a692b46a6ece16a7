import sanitizeHtml from 'sanitize-html';

// What the editor produces (StarterKit, links, task lists); everything else is dropped.
const allowed: sanitizeHtml.IOptions = {
  allowedTags: ['p', 'br', 'strong', 'em', 's', 'u', 'code', 'pre', 'blockquote', 'h1', 'h2', 'h3', 'ul', 'ol', 'li', 'a', 'hr', 'label', 'input', 'div', 'span'],
  allowedAttributes: { a: ['href', 'rel', 'target'], ul: ['data-type'], li: ['data-type', 'data-checked'], input: ['type', 'checked', 'disabled'] },
  allowedSchemes: ['http', 'https', 'mailto'],
  transformTags: { a: sanitizeHtml.simpleTransform('a', { rel: 'noopener noreferrer', target: '_blank' }) },
};

/** Rich text as stored: only the editor's own markup survives. */
export const sanitizeRichText = (html: string) => sanitizeHtml(html, allowed);

/** The words of rich text, for search and plain-text views. */
export const richTextToPlain = (html: string) => sanitizeHtml(html, { allowedTags: [], allowedAttributes: {} }).replace(/\s+/g, ' ').trim();
