/**
 * Writes one property set per member into a copy of an uploaded IFC model, related by a
 * new IfcRelDefinesByProperties, and returns the saved bytes. Nothing else in the model
 * is touched. Forces are written in the model's own force unit (N when it assigns none),
 * because IfcForceMeasure values are read in the project's units.
 */
import { Handle, IFC2X3, IFC4, IFC4X3, IFCOWNERHISTORY, IFCPROJECT } from 'web-ifc';
import { getIfcApi } from './ifc-api.ts';
import { ModelContext } from './model-context.ts';
import { openModel } from './open-model.ts';
import { readUnits } from './units.ts';

/** A property value; forces are given in N and converted to the model's unit here. */
export type PsetValue =
  | { kind: 'ratio'; value: number }
  | { kind: 'force'; valueN: number }
  | { kind: 'label'; value: string }
  | { kind: 'text'; value: string }
  /** YYYY-MM-DD; IfcDate where the schema has it (IFC4 on), IfcLabel in IFC2X3. */
  | { kind: 'date'; value: string };

export interface MemberPset {
  globalId: string;
  properties: ({ name: string } & PsetValue)[];
}

export interface WriteResultsOutcome {
  bytes: Uint8Array;
  /** GlobalIds that received the property set. */
  written: string[];
  /** GlobalIds not found in the model (nothing written for them). */
  missing: string[];
  forceUnit: string;
}

export async function writePropertySets(bytes: Uint8Array, psetName: string, members: MemberPset[]): Promise<WriteResultsOutcome> {
  const api = await getIfcApi();
  const opened = openModel(api, bytes);
  const m = opened.modelID;
  try {
    const S: any = opened.schema === 'IFC2X3' ? IFC2X3 : opened.schema === 'IFC4X3' ? IFC4X3 : IFC4;
    const ctx = new ModelContext(api, m, opened.schema);
    const units = readUnits(ctx, ctx.idsOfType(IFCPROJECT)[0]);
    // IFC2X3 requires an owner history on rooted entities; reuse the model's own.
    const ownerId = opened.schema === 'IFC2X3' ? ctx.idsOfType(IFCOWNERHISTORY)[0] : undefined;
    const owner = ownerId ? new Handle(ownerId) : null;

    const value = (p: PsetValue) => {
      switch (p.kind) {
        case 'ratio':
          return new S.IfcRatioMeasure(p.value);
        case 'force':
          return new S.IfcForceMeasure(p.valueN / units.forceToN);
        case 'label':
          return new S.IfcLabel(p.value.slice(0, 255));
        case 'text':
          return new S.IfcText(p.value);
        case 'date':
          return opened.schema === 'IFC2X3' ? new S.IfcLabel(p.value) : new S.IfcDate(p.value);
      }
    };

    const written: string[] = [];
    const missing: string[] = [];
    for (const member of members) {
      const id = Number(api.GetExpressIdFromGuid(m, member.globalId));
      if (!Number.isInteger(id) || id <= 0) {
        missing.push(member.globalId);
        continue;
      }
      const props = member.properties.map((p) => new S.IfcPropertySingleValue(new S.IfcIdentifier(p.name), null, value(p), null));
      const pset = new S.IfcPropertySet(api.CreateIFCGloballyUniqueId(m), owner, new S.IfcLabel(psetName), null, props);
      const rel = new S.IfcRelDefinesByProperties(api.CreateIFCGloballyUniqueId(m), owner, null, null, [new Handle(id)], pset);
      api.WriteLine(m, rel);
      written.push(member.globalId);
    }
    return { bytes: api.SaveModel(m), written, missing, forceUnit: units.forceUnitName };
  } finally {
    api.CloseModel(m);
  }
}
