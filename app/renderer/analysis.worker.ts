import { analysisWorkerServe, type AnalysisRequest } from './analysis-request';

// The sweeps and the nonlinear simulation run here, off the page's thread, so that typing and
// scrolling never wait for them; the page cancels a job by a message, read between corners.
const serve = analysisWorkerServe((r) => self.postMessage(r));
self.addEventListener('message', (e: MessageEvent<AnalysisRequest>) => serve(e.data));
