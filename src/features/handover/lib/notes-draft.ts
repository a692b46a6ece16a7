// Notes typed but not yet confirmed by the server are kept on this device, per handover, so a
// reload, a closed tab or a lost connection does not lose them. Cleared once the server has them.
export type LocalNotesDraft = { html: string; baseVersion: number; savedAt: string };

const keyOf = (handoverId: number) => `hotwell.handover-notes.${handoverId}`;

export function readLocalDraft(handoverId: number): LocalNotesDraft | null {
  try {
    const raw = localStorage.getItem(keyOf(handoverId));
    if (!raw) return null;
    const parsed = JSON.parse(raw) as Partial<LocalNotesDraft>;
    return typeof parsed.html === 'string' && typeof parsed.baseVersion === 'number' ? { html: parsed.html, baseVersion: parsed.baseVersion, savedAt: String(parsed.savedAt ?? '') } : null;
  } catch {
    return null;
  }
}

export function writeLocalDraft(handoverId: number, html: string, baseVersion: number) {
  try {
    localStorage.setItem(keyOf(handoverId), JSON.stringify({ html, baseVersion, savedAt: new Date().toISOString() } satisfies LocalNotesDraft));
  } catch {
    // Storage full or disabled: the autosave still runs; only the reload safety net is lost.
  }
}

export function clearLocalDraft(handoverId: number) {
  try {
    localStorage.removeItem(keyOf(handoverId));
  } catch {
    // nothing to clear
  }
}
