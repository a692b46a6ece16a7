// Who is signed in on this tab, as the queue sees it: a pass sends only its author's records, and
// stops when the session ends. Its own small module so the shell can say so without loading the queue.
let sessionUserId: number | null = null;

export function noteSignedInPerson(userId: number | null) {
  sessionUserId = userId;
}

export const signedInPerson = () => sessionUserId;
