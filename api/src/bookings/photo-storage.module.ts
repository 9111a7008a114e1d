import { Global, Module } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type { AppConfig } from '../config/configuration';
import { LocalDiskPhotoStorage, PhotoStorage, S3PhotoStorage, s3ClientFor } from './photo-storage';

/** The photo store PHOTO_STORAGE names, shared by the bookings (uploads) and health (readiness). */
@Global()
@Module({
  providers: [
    {
      provide: PhotoStorage,
      inject: [ConfigService],
      useFactory: (config: ConfigService<AppConfig, true>) => {
        const storage = config.get('storage', { infer: true });
        return storage.driver === 's3'
          ? new S3PhotoStorage(s3ClientFor(storage.s3), storage.s3.bucket)
          : new LocalDiskPhotoStorage(storage.uploadsDir);
      },
    },
  ],
  exports: [PhotoStorage],
})
export class PhotoStorageModule {}
