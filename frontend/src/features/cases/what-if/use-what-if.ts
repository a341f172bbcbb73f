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
  uncertaintyMs: number | null;
}

const IDLE: WhatIf = { figures: null, full: null, computingFigures: false, computingUncertainty: false, error: null, figuresMs: null, uncertaintyMs: null };

const startWorker = () => new Worker(new URL('./what-if.worker.ts', import.meta.url), { type: 'module', name: 'case what-if' });

/**
 * Recomputes a case in the browser whenever `inputs` changes (null = nothing edited). Two workers: the quick
 * figures come from one that is never held up; the uncertainty pass runs in the other, which is restarted when
 * newer inputs arrive so a stale Monte Carlo never delays the current one.
 */
export function useWhatIf(inputs: CalcScheduleInput | null): WhatIf {
  const [state, setState] = useState<WhatIf>(IDLE);
  const figuresWorker = useRef<Worker | null>(null);
  const uncertaintyWorker = useRef<Worker | null>(null);
  const uncertaintyBusy = useRef(false);
  const latest = useRef({ id: 0, sentAt: 0 });

  useEffect(
    () => () => {
      figuresWorker.current?.terminate();
      uncertaintyWorker.current?.terminate();
    },
    [],
  );

  useEffect(() => {
    if (!inputs) {
      latest.current = { id: latest.current.id + 1, sentAt: 0 };
      // nothing edited (or just saved): the server's figures are shown
      // eslint-disable-next-line react-hooks/set-state-in-effect -- the worker's answers are external state
      setState(IDLE);
      return;
    }
    const id = latest.current.id + 1;
    latest.current = { id, sentAt: performance.now() };
    const onAnswer = (event: MessageEvent<WhatIfAnswer>) => {
      const a = event.data;
      if (a.id !== latest.current.id) return;
      const elapsed = performance.now() - latest.current.sentAt;
      if (a.pass === 'uncertainty') uncertaintyBusy.current = false;
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
    const send = (worker: Worker, pass: WhatIfPass) => worker.postMessage({ id, pass, inputs } satisfies WhatIfRequest);
    send(figuresWorker.current, 'figures');
    if (inputs.uncertainty !== undefined) {
      uncertaintyWorker.current ??= startWorker();
      uncertaintyWorker.current.onmessage = onAnswer;
      uncertaintyBusy.current = true;
      send(uncertaintyWorker.current, 'uncertainty');
    }
  }, [inputs]);

  return state;
}

function applyAnswer(s: WhatIf, a: WhatIfAnswer, elapsed: number): WhatIf {
  if (!a.ok) return { ...s, error: a.message, computingFigures: a.pass === 'figures' ? false : s.computingFigures, computingUncertainty: false };
  if (a.pass === 'figures') return { ...s, figures: a.results, error: null, computingFigures: false, figuresMs: elapsed };
  return { ...s, full: a.results, figures: s.figures ?? a.results, computingUncertainty: false, uncertaintyMs: elapsed };
}
