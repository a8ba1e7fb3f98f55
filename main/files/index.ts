// Node-side file helpers: atomic writes, reading small text files, plain-language reasons for file-system errors.
export { writeFileAtomic, writeFileAtomicWith } from './atomicWrite';
export { describeFileProblem, errorCode } from './fileProblem';
export { NOT_REGULAR_FILE_CODE, READ_NO_WAIT_FLAGS, readSmallTextFile, requireRegularFile } from './readTextFile';
