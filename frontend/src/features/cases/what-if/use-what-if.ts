import { useEffect, useRef, useState } from 'react';
import type { CalcScheduleInput, CalcScheduleOutput } from '@shared/schemas/calc-schedule';
import type { WhatIfAnswer, WhatIfPass, WhatIfRequest } from './what-if-compute';

export interface WhatIf {
  /** figures for the edited inputs (no sensitivity or Monte Carlo until `uncertainty` arrives), or null */
  figures: CalcScheduleOutput | null;
  /** the last full results, uncertainty included (of the current inputs unless `computingUncertainty`) */
  full: CalcScheduleOutput | null;
  computingFigures: boolean;
  computingUncertainty: boolean;
  error: string | null;
  /** time from the edit to the figures on screen, ms (the last edit) */
  figuresMs: number | null;
  /** of which the computation itself in the worker, ms */
  figuresComputeMs: number | null;
  uncertaintyMs: number | null;
}

const IDLE: WhatIf = {
  figures: null,
  full: null,
  computingFigures: false,
  computingUncertainty: false,
  error: null,
  figuresMs: null,
  figuresComputeMs: null,
  uncertaintyMs: null,
};

const startWorker = () => new Worker(new URL('./what-if.worker.ts', import.meta.url), { type: 'module', name: 'case what-if' });

/**
 * Recomputes a case in the browser whenever `inputs` changes (null = nothing edited). Two workers: the quick
 * figures come from one that is never held up; the uncertainty pass then runs in the other, which is restarted
 * when newer inputs arrive so a stale Monte Carlo never delays the current one.
 */
export function useWhatIf(inputs: CalcScheduleInput | null, warmUpWith: CalcScheduleInput | null): WhatIf {
  const [state, setState] = useState<WhatIf>(IDLE);
  const figuresWorker = useRef<Worker | null>(null);
  const uncertaintyWorker = useRef<Worker | null>(null);
  const uncertaintyBusy = useRef(false);
  const latest = useRef<{ id: number; sentAt: number; inputs: CalcScheduleInput | null }>({ id: 0, sentAt: 0, inputs: null });

  useEffect(
    () => () => {
      figuresWorker.current?.terminate();
      uncertaintyWorker.current?.terminate();
    },
    [],
  );

  // A case that may be edited starts its figures worker at once and computes the saved inputs in it, so the
  // first edit finds the engine loaded and compiled (a cold worker takes several times longer).
  useEffect(() => {
    if (!warmUpWith || figuresWorker.current) return;
    figuresWorker.current = startWorker();
    figuresWorker.current.postMessage({ id: -1, pass: 'figures', inputs: warmUpWith } satisfies WhatIfRequest);
  }, [warmUpWith]);

  useEffect(() => {
    if (!inputs) {
      latest.current = { id: latest.current.id + 1, sentAt: 0, inputs: null };
      // nothing edited (or just saved): the server's figures are shown
      // eslint-disable-next-line react-hooks/set-state-in-effect -- the worker's answers are external state
      setState(IDLE);
      return;
    }
    const id = latest.current.id + 1;
    latest.current = { id, sentAt: performance.now(), inputs };
    const send = (worker: Worker, pass: WhatIfPass) => worker.postMessage({ id, pass, inputs } satisfies WhatIfRequest);
    const onAnswer = (event: MessageEvent<WhatIfAnswer>) => {
      const a = event.data;
      if (a.id !== latest.current.id) return;
      const elapsed = performance.now() - latest.current.sentAt;
      if (a.pass === 'uncertainty') uncertaintyBusy.current = false;
      // the uncertainty pass starts once the figures are on screen, so the figures have a core to themselves
      if (a.pass === 'figures' && a.ok && inputs.uncertainty !== undefined) {
        uncertaintyWorker.current ??= startWorker();
        uncertaintyWorker.current.onmessage = onAnswer;
        uncertaintyBusy.current = true;
        send(uncertaintyWorker.current, 'uncertainty');
      }
      setState((s) => applyAnswer(s, a, elapsed));
    };
    figuresWorker.current ??= startWorker();
    figuresWorker.current.onmessage = onAnswer;
    if (uncertaintyBusy.current) {
      uncertaintyWorker.current?.terminate();
      uncertaintyWorker.current = null;
    }
    setState((s) => ({
      ...s,
      computingFigures: true,
      computingUncertainty: inputs.uncertainty !== undefined,
      full: inputs.uncertainty === undefined ? null : s.full,
    }));
    send(figuresWorker.current, 'figures');
  }, [inputs]);

  return state;
}

function applyAnswer(s: WhatIf, a: WhatIfAnswer, elapsed: number): WhatIf {
  if (!a.ok) return { ...s, error: a.message, computingFigures: a.pass === 'figures' ? false : s.computingFigures, computingUncertainty: false };
  if (a.pass === 'figures') return { ...s, figures: a.results, error: null, computingFigures: false, figuresMs: elapsed, figuresComputeMs: a.ms };
  return { ...s, full: a.results, figures: s.figures ?? a.results, computingUncertainty: false, uncertaintyMs: elapsed };
}
