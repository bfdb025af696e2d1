/**
 * The three BCF 2.1 XML documents Gaugeline writes (bcf.version, markup.bcf,
 * viewpoint.bcfv), as plain strings in the element order the buildingSMART schemas
 * require. Validated against those schemas in the tests.
 */
export type V3 = [number, number, number];

/** Escapes text and attribute values; drops characters XML 1.0 does not allow. */
export function xml(s: string | number): string {
  return String(s)
    .replace(/[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/g, '')
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&apos;');
}

const HEAD = '<?xml version="1.0" encoding="UTF-8"?>\n';

export function versionXml(): string {
  return `${HEAD}<Version VersionId="2.1">\n  <DetailedVersion>2.1</DetailedVersion>\n</Version>\n`;
}

export interface TopicXml {
  topicGuid: string;
  viewpointGuid: string;
  title: string;
  description: string;
  labels: string[];
  /** xs:dateTime */
  created: string;
  author: string;
  fileName: string;
  fileDate: string;
  index: number;
}

export function markupXml(t: TopicXml): string {
  const labels = t.labels.map((l) => `    <Labels>${xml(l)}</Labels>\n`).join('');
  return (
    `${HEAD}<Markup>\n` +
    `  <Header>\n    <File isExternal="true">\n      <Filename>${xml(t.fileName)}</Filename>\n      <Date>${xml(t.fileDate)}</Date>\n    </File>\n  </Header>\n` +
    `  <Topic Guid="${t.topicGuid}" TopicType="Tension check" TopicStatus="Open">\n` +
    `    <Title>${xml(t.title)}</Title>\n` +
    `    <Index>${t.index}</Index>\n` +
    labels +
    `    <CreationDate>${xml(t.created)}</CreationDate>\n` +
    `    <CreationAuthor>${xml(t.author)}</CreationAuthor>\n` +
    `    <Description>${xml(t.description)}</Description>\n` +
    `  </Topic>\n` +
    `  <Viewpoints Guid="${t.viewpointGuid}">\n    <Viewpoint>viewpoint.bcfv</Viewpoint>\n  </Viewpoints>\n` +
    `</Markup>\n`
  );
}

export interface ViewpointXml {
  viewpointGuid: string;
  ifcGuid: string;
  /** Six hex digits, upper case. */
  colour: string;
  camera: { position: V3; direction: V3; up: V3; fieldOfView: number } | null;
}

const point = (tag: string, v: V3, pad: string) =>
  `${pad}<${tag}>\n${pad}  <X>${v[0]}</X>\n${pad}  <Y>${v[1]}</Y>\n${pad}  <Z>${v[2]}</Z>\n${pad}</${tag}>\n`;

export function viewpointXml(v: ViewpointXml): string {
  const camera = v.camera
    ? `  <PerspectiveCamera>\n${point('CameraViewPoint', v.camera.position, '    ')}${point('CameraDirection', v.camera.direction, '    ')}${point('CameraUpVector', v.camera.up, '    ')}    <FieldOfView>${v.camera.fieldOfView}</FieldOfView>\n  </PerspectiveCamera>\n`
    : '';
  return (
    `${HEAD}<VisualizationInfo Guid="${v.viewpointGuid}">\n` +
    `  <Components>\n` +
    `    <Selection>\n      <Component IfcGuid="${xml(v.ifcGuid)}"/>\n    </Selection>\n` +
    `    <Visibility DefaultVisibility="true"/>\n` +
    `    <Coloring>\n      <Color Color="${v.colour}">\n        <Component IfcGuid="${xml(v.ifcGuid)}"/>\n      </Color>\n    </Coloring>\n` +
    `  </Components>\n` +
    camera +
    `</VisualizationInfo>\n`
  );
}
