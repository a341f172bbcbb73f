/**
 * The case page's what-if computation off the main thread. Requests that arrive while one is computing are
 * coalesced: only the newest is computed next, so a burst of keystrokes costs one computation, not one each.
 */
import { answer, type WhatIfRequest } from './what-if-compute';

// the browser project's library is the DOM's; inside a dedicated worker `self` is the worker's own scope
const scope = self as unknown as { postMessage: (message: unknown) => void; onmessage: ((event: MessageEvent<WhatIfRequest>) => void) | null };

let waiting: WhatIfRequest | null = null;
let scheduled = false;

function computeNewest() {
  scheduled = false;
  const request = waiting;
  waiting = null;
  if (request) scope.postMessage(answer(request));
}

scope.onmessage = (event) => {
  waiting = event.data;
  if (!scheduled) {
    scheduled = true;
    setTimeout(computeNewest, 0);
  }
};
