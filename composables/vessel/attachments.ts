export interface AttachmentItem { id: string, fileName: string, contentType: string, sizeBytes: number, image: boolean, url: string }
