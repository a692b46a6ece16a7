import { Notice } from '../../../components/ui/notice';
import { useAcknowledge, usePendingOrders } from '../api/orders';
import { Button } from '../../../components/ui/button';

/** Shown after sign-in until every standing order addressed to this person is acknowledged. */
export function PendingOrdersPrompt({ enabled }: { enabled: boolean }) {
  const pending = usePendingOrders(enabled);
  const acknowledge = useAcknowledge();
  if (!pending.data?.length) return null;
  return (
    <section role="dialog" aria-label="Standing orders to acknowledge" className="mx-auto mt-4 flex max-w-6xl flex-col gap-3 rounded-lg border-4 border-watch bg-panel p-4">
      <h2 className="text-lg font-bold">▲ Standing orders for you to read and acknowledge</h2>
      {acknowledge.error ? <Notice kind="error">{acknowledge.error.message}</Notice> : null}
      {pending.data.map((order) => (
        <article key={order.id} className="border-t border-line pt-2">
          <h3 className="font-bold">{order.title}</h3>
          <div className="order-body" dangerouslySetInnerHTML={{ __html: order.bodyHtml }} />
          <Button size="sm" className="mt-2" onClick={() => acknowledge.mutate(order.id)}>
            I have read this order
          </Button>
        </article>
      ))}
    </section>
  );
}
