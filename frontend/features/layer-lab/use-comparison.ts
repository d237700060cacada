import { useCallback, useEffect, useRef, useState } from 'react';
import type { BlankResult, CompareMessage, CompareRequest } from './worker/protocol';

export type ComparisonState =
  | { status: 'idle' }
  | { status: 'running'; fraction: number }
  | { status: 'done'; results: BlankResult[]; elapsedMs: number }
  | { status: 'error'; message: string };

/** Runs comparisons in a Web Worker; a new run stops the one before it. */
export function useComparison(): [ComparisonState, (request: CompareRequest) => void] {
  const [state, setState] = useState<ComparisonState>({ status: 'idle' });
  const worker = useRef<Worker | null>(null);

  useEffect(() => () => worker.current?.terminate(), []);

  const run = useCallback((request: CompareRequest) => {
    worker.current?.terminate();
    const w = new Worker(new URL('./worker/compare.worker.ts', import.meta.url), {
      type: 'module',
    });
    worker.current = w;
    setState({ status: 'running', fraction: 0 });
    w.onmessage = (event: MessageEvent<CompareMessage>) => {
      const m = event.data;
      if (m.type === 'progress') setState({ status: 'running', fraction: m.fraction });
      else if (m.type === 'done')
        setState({ status: 'done', results: m.results, elapsedMs: m.elapsedMs });
      else setState({ status: 'error', message: m.message });
      if (m.type !== 'progress') w.terminate();
    };
    w.onerror = (e) =>
      setState({ status: 'error', message: e.message || 'the calculation failed' });
    w.postMessage(request);
  }, []);

  return [state, run];
}
