// Unit tests run in Node: give Dexie an IndexedDB to work with.
import "fake-indexeddb/auto";
