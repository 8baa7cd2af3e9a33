/** The kinds of upload and their size limits: plain data, so forms can check a size before sending. */
export const uploadKinds = ['photo', 'svg', 'pdf'] as const;
export type UploadKind = (typeof uploadKinds)[number];

const MB = 1024 * 1024;

/** Size limit per kind, bytes. */
export const uploadLimits: Record<UploadKind, number> = { photo: 10 * MB, svg: 1 * MB, pdf: 20 * MB };
