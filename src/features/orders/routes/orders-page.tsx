import { useState } from 'react';
import { can } from '../../../../shared/policies/permissions';
import { useSelectedUnit } from '../../../components/readings/unit-picker';
import { Notice } from '../../../components/ui/notice';
import { useStationZone } from '../../../components/station-time/use-station-zone';
import { ZoneNote } from '../../../components/station-time/zone-note';
import { formatStationTime } from '../../../../shared/station-time';
import { useMe } from '../../session';
import { useOrder, useOrders } from '../api/orders';
import { IssueOrderForm } from '../components/issue-order-form';
import { useStationSettings } from '../../shifts';
import { Button } from '../../../components/ui/button';


function WhoHasRead({ id, stamp }: { id: number; stamp: (iso: string) => string }) {
  const order = useOrder(id);
  if (!order.data?.people) return null;
  return (
    <ul className="mt-2 grid gap-1 text-sm sm:grid-cols-2" aria-label="Acknowledgements">
      {order.data.people.map((p) => (
        <li key={p.id}>{p.acknowledgedAt ? `✔ ${p.name} — read ${stamp(p.acknowledgedAt)}` : `○ ${p.name} — not yet`}</li>
      ))}
    </ul>
  );
}

export function OrdersPage() {
  const { data: me } = useMe();
  const { unit } = useSelectedUnit();
  const [state, setState] = useState('in_force');
  const [q, setQ] = useState('');
  const [open, setOpen] = useState<number | null>(null);
  const orders = useOrders(state, q);
  const settings = useStationSettings(unit?.stationId ?? null);
  // The list is the first station's (the server's choice when none is named), so its zone applies.
  const zone = useStationZone(null);
  const stamp = (iso: string) => (zone ? formatStationTime(iso, zone.timeZone) : '…');
  const mayIssue = Boolean(me && can(me.role, 'order.issue'));
  return (
    <section className="flex flex-col gap-4">
      <h1 className="text-2xl font-bold">Standing orders</h1>
      <ZoneNote zone={zone} />
      {mayIssue && settings.data && zone ? <IssueOrderForm positions={settings.data.positions} timeZone={zone.timeZone} /> : null}
      <div className="flex flex-wrap gap-2 text-sm">
        <label className="flex flex-col">
          Show
          <select className="rounded-md border border-line bg-field px-2 py-1" value={state} onChange={(e) => setState(e.target.value)}>
            <option value="in_force">In force</option>
            <option value="archived">Archived (expired)</option>
            <option value="all">All</option>
          </select>
        </label>
        <label className="flex flex-col">
          Search
          <input className="rounded-md border border-line bg-field px-2 py-1" value={q} onChange={(e) => setQ(e.target.value)} />
        </label>
      </div>
      {orders.error ? <Notice kind="error">{orders.error.message}</Notice> : null}
      {orders.data?.length === 0 ? <Notice kind="info">No standing orders match.</Notice> : null}
      {orders.data?.map((o) => (
        <article key={o.id} className="rounded-lg border border-line bg-panel p-3" aria-label={`Order: ${o.title}`}>
          <header className="flex flex-wrap items-baseline gap-2">
            <h2 className="font-bold">{o.title}</h2>
            <span className="text-sm text-muted">
              {o.inForce ? 'in force' : 'not in force'} · from {stamp(o.effectiveFrom)}
              {o.effectiveTo ? ` to ${stamp(o.effectiveTo)}` : ''} · issued by {o.issuedBy}
            </span>
            <span className="ml-auto text-sm font-bold" data-testid={`acks-${o.id}`}>
              {o.acknowledged} of {o.inScope} acknowledged
            </span>
          </header>
          <div className="order-body mt-1" dangerouslySetInnerHTML={{ __html: o.bodyHtml }} />
          <Button tone="link" className="mt-1 text-sm" onClick={() => setOpen(open === o.id ? null : o.id)}>
            {open === o.id ? 'Hide who has read it' : 'Who has read it'}
          </Button>
          {open === o.id ? <WhoHasRead id={o.id} stamp={stamp} /> : null}
        </article>
      ))}
    </section>
  );
}
