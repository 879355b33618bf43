import type { RequestHandler } from 'express';
import multer from 'multer';
import { orgParamsSchema } from '@wickstone/contracts';
import { fieldError } from '../errors.js';
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
      fieldError('file', 'Expected a multipart upload', {
        code: 'unsupported_media_type',
        message: 'Send the image as multipart/form-data in the field "file"',
      }),
    );
    return;
  }
  upload.single('file')(req, res, (err: unknown) => {
    if (!err) return next();
    if (err instanceof multer.MulterError) {
      if (err.code === 'LIMIT_FILE_SIZE') {
        return next(
          fieldError('file', `At most ${MAX_LOGO_BYTES / 1024} KB`, {
            code: 'payload_too_large',
            message: `The image is larger than ${MAX_LOGO_BYTES / 1024} KB`,
            cause: err,
          }),
        );
      }
      return next(
        fieldError(err.field ?? 'file', err.message, {
          message: `Invalid upload: ${err.message}`,
          cause: err,
        }),
      );
    }
    next(
      fieldError('file', 'Malformed multipart body', {
        code: 'bad_request',
        message: 'The upload could not be read',
        cause: err,
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
        throw fieldError('file', 'Required');
      }
      return { status: 201, body: await assets.upload(org.id, session.user.id, req.file.buffer) };
    },
  );
}
