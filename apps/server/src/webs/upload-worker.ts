import { lowerWorkerPriority } from '@seinework/draw-pool';
import { readUpload, type UploadFile, type WebFields, type WebRead } from '@seinework/web-tables';

/**
 * Upload reader thread: unpacking a workbook and checking tens of thousands of rows takes
 * seconds at the size limit, which the thread answering requests must not spend.
 */

lowerWorkerPriority();

export interface UploadTask {
  readonly files: readonly UploadFile[];
  readonly fields: WebFields;
}

export default function readUploadTask(task: UploadTask): Promise<WebRead> {
  return readUpload(task.files, task.fields);
}
