// Under load many people ask for the same page of the same unit at once (everyone on shift has the
// overview open; each live event makes every open log page ask again). Identical reads asked while
// one is running share the next one: it starts as soon as the running read ends and answers
// everyone who asked meanwhile. A request is never answered from a read that began before it
// arrived, so it sees every change committed before it was made — as fresh as reading alone, with
// one database round instead of one per person.
//
// Only for reads outside a transaction (the shared read runs in the context of whoever started it).
export function coalesced<A, T>(read: (arg: A) => Promise<T>, keyOf: (arg: A) => string): (arg: A) => Promise<T> {
  const byKey = new Map<string, { running: Promise<T> | null; next: Promise<T> | null }>();
  return (arg: A) => {
    const key = keyOf(arg);
    let state = byKey.get(key);
    if (!state) byKey.set(key, (state = { running: null, next: null }));
    const slot = state;
    const start = (): Promise<T> => {
      const reading = read(arg);
      slot.running = reading;
      const settled = () => {
        if (slot.running !== reading) return;
        slot.running = null;
        if (!slot.next) byKey.delete(key);
      };
      reading.then(settled, settled);
      return reading;
    };
    if (!slot.running) return start();
    slot.next ??= slot.running.then(
      () => undefined,
      () => undefined,
    ).then(() => {
      slot.next = null;
      return start();
    });
    return slot.next;
  };
}
