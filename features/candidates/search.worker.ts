import { expose } from 'comlink';
import { createSearchService } from './search-service';

// Runs in a Web Worker (search-runner.web.ts starts it): the search's batches never hold up the page.
expose(createSearchService());
