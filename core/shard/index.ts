// Public surface of core/shard: splitting a batch into parts (balanced by file size) and checking and merging parts.
export { parseShardSpec, partFolderName, parsePartFolderName, MAX_PARTS, type ShardSpec } from './shard-spec';
export { assignParts, filesOfPart, inputListText, type SizedFile } from './assign';
export {
  checkParts, canonicalJson, firstDifference, isUnfinished, type PartEntry, type PartsPlan, type CheckPartsResult,
} from './check-parts';
export { orderLikeOneRun, mergeRunRecords, type MergedRecordFacts } from './merge-record';
