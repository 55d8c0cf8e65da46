import type { Response } from 'express';
import type { MachineFile } from '../services/zone-files/zone-machine-files.ts';

/** Answers with a zone file as a download, under the name that says which field, pest and version it is. */
export function sendMachineFile(res: Response, file: MachineFile) {
  res.setHeader('Content-Type', file.contentType);
  res.setHeader('Content-Disposition', `attachment; filename="${file.fileName}"`);
  res.send(file.bytes);
}
