import { ShiftCondenserPanel } from '../../../components/condenser/shift-condenser-panel';
import { Notice } from '../../../components/ui/notice';
import type { Board } from '../api/handover';
import { useShiftCondenser } from '../api/get-shift-condenser';

/** Beside the notes: the live condenser state while the handover is a draft, the frozen copy once submitted. */
export function HandoverCondenser({ board }: { board: Board }) {
  const h = board.handover;
  const snapshot = h.status === 'draft' ? null : h.condenserSnapshot;
  // A handover submitted before snapshots existed has none: show its shift as the rounds say now.
  const live = useShiftCondenser(snapshot ? null : h.unitId, h.status === 'draft' ? null : h.shiftStart);
  if (snapshot) return <ShiftCondenserPanel state={snapshot.state} frozenAt={snapshot.frozenAt} />;
  if (live.error) return <Notice kind="error">{live.error.message}</Notice>;
  if (!live.data) return <p className="text-sm text-muted">Loading the condenser’s shift…</p>;
  return <ShiftCondenserPanel state={live.data} />;
}
