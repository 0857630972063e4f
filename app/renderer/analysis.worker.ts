import { analysisRequestAnswer, type AnalysisRequest } from './analysis-request';

// The sweeps and the nonlinear simulation run here, off the page's thread, so that typing and
// scrolling never wait for them; the page cancels by ending this worker.
self.addEventListener('message', (e: MessageEvent<AnalysisRequest>) =>
  analysisRequestAnswer(e.data, (r) => self.postMessage(r)),
);
