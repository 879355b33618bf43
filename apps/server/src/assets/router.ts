import type { RequestHandler } from 'express';
import multer from 'multer';
import { orgParamsSchema } from '@wickstone/contracts';
import { AppError } from '../errors.js';
import type { ApiRoutes } from '../http/routes.js';
import { MAX_LOGO_BYTES } from './image.js';
import type { AssetService } from './service.js';

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_LOGO_BYTES, files: 1, fields: 0, parts: 2 },
});

/** multer's own errors, in the one error shape, naming the field. */
const singleFile: RequestHandler = (req, res, next) => {
  if (!req.is('multipart/form-data')) {
    next(
      new AppError('unsupported_media_type', 'Send the image as multipart/form-data in the field "file"', {
        fields: [{ field: 'file', message: 'Expected a multipart upload' }],
      }),
    );
    return;
  }
  upload.single('file')(req, res, (err: unknown) => {
    if (!err) return next();
    if (err instanceof multer.MulterError) {
      if (err.code === 'LIMIT_FILE_SIZE') {
        return next(
          new AppError('payload_too_large', `The image is larger than ${MAX_LOGO_BYTES / 1024} KB`, {
            fields: [{ field: 'file', message: `At most ${MAX_LOGO_BYTES / 1024} KB` }],
          }),
        );
      }
      return next(
        new AppError('validation_failed', `Invalid upload: ${err.message}`, {
          fields: [{ field: err.field ?? 'file', message: err.message }],
        }),
      );
    }
    next(
      new AppError('bad_request', 'The upload could not be read', {
        fields: [{ field: 'file', message: 'Malformed multipart body' }],
      }),
    );
  });
};

export function assetRoutes(routes: ApiRoutes, assets: AssetService): void {
  routes.post(
    '/orgs/:orgId/assets',
    { access: 'assets:write', params: orgParamsSchema, use: [singleFile] },
    async ({ req, org, session }) => {
      if (!req.file) {
        throw new AppError('validation_failed', 'Invalid request: check file', {
          fields: [{ field: 'file', message: 'Required' }],
        });
      }
      return { status: 201, body: await assets.upload(org.id, session.user.id, req.file.buffer) };
    },
  );
}
