import { expose } from 'comlink';
import { createTraceService } from './trace-service';

// Runs in a Web Worker (trace-runner.web.ts starts it): a trace never holds up the editor's frame.
expose(createTraceService());
