import { createHash } from 'node:crypto';
import type { Asset as AssetDto } from '@wickstone/contracts';
import { Asset } from '../db/models/index.js';
import { assetUrl } from '../widgets/service.js';
import { cleanImage } from './image.js';

export interface AssetService {
  /**
   * Store an uploaded image as decoded and encoded again (`cleanImage`); the same image twice is
   * stored once.
   */
  upload(orgId: number, userId: number, data: Buffer): Promise<AssetDto>;
}

export function createAssetService(publicUrl: string): AssetService {
  const dto = (a: Asset): AssetDto => ({
    id: a.id,
    url: assetUrl(publicUrl, a),
    contentType: a.contentType,
    bytes: a.bytes,
    width: a.width,
    height: a.height,
  });
  return {
    async upload(orgId, userId, upload) {
      const clean = await cleanImage(upload);
      const data = clean.data;
      const sha256 = createHash('sha256').update(data).digest('hex');
      const existing = await Asset.findOne({
        where: { organizationId: orgId, sha256 },
        attributes: { exclude: ['data'] },
      });
      if (existing) return dto(existing);
      const a = await Asset.create({
        organizationId: orgId,
        contentType: clean.contentType,
        bytes: data.length,
        width: clean.width,
        height: clean.height,
        sha256,
        data,
        uploadedBy: userId,
      });
      return dto(a);
    },
  };
}
