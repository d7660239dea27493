// A site's review policy as the engine reads it: the site's overrides over the engine's defaults.
import { SitePolicy } from '@shared/schemas/site-policy';
import type { Site } from './site.entity';

export function sitePolicy(site: Site) {
  return SitePolicy.parse(site.reviewPolicy ?? {});
}
