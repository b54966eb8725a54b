// Every unit test sees an in-memory IndexedDB, so store tests run in Node.
import 'fake-indexeddb/auto';
