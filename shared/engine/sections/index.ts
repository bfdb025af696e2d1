export { grossArea, filletArea, filletCentroid } from './gross-area.ts';
export { developedStrip, developedWidth, segmentAt, type DevelopedStrip, type StripSegment } from './developed-strip.ts';
export { locateOnStrip, type StripLocation } from './locate.ts';
export { connectionEccentricity, connectedElementArea, type ConnectedElements } from './eccentricity.ts';
