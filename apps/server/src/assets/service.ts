import { createHash } from 'node:crypto';
import type { Asset as AssetDto } from '@wickstone/contracts';
import { Asset } from '../db/models/index.js';
import { assetUrl } from '../widgets/service.js';
import { inspectImage } from './image.js';

export interface AssetService {
  /** Store an uploaded image after checking what it is by its bytes; the same image twice is stored once. */
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
    async upload(orgId, userId, data) {
      const info = inspectImage(data);
      const sha256 = createHash('sha256').update(data).digest('hex');
      const existing = await Asset.findOne({
        where: { organizationId: orgId, sha256 },
        attributes: { exclude: ['data'] },
      });
      if (existing) return dto(existing);
      const a = await Asset.create({
        organizationId: orgId,
        contentType: info.contentType,
        bytes: data.length,
        width: info.width,
        height: info.height,
        sha256,
        data,
        uploadedBy: userId,
      });
      return dto(a);
    },
  };
}
