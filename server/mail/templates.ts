import { CAUTIONS } from '@shared/api/cautions';
import { JOB_STATUS_LABELS } from '@shared/api/models';
import { STANDARD_LABELS, type StandardId } from '@shared/api/projects';

const cautionBlock = () => ['', 'Cautions:', ...CAUTIONS.map((c) => `- ${c}`)].join('\n');
const signature = '\n--\nGaugeline — tension members and their bolted ends, checked from the building model.';

export function importFinishedMail(p: { projectName: string; modelName: string; revisionNumber: number; standard: string; link: string; tensionMembers: number; checked: number; over: number; tight: number }) {
  return {
    subject: `Checked: ${p.modelName} r${p.revisionNumber} (${p.projectName})`,
    text: [
      `Revision ${p.revisionNumber} of "${p.modelName}" in ${p.projectName} has been checked to ${STANDARD_LABELS[p.standard as StandardId] ?? p.standard}.`,
      '',
      `Tension members found: ${p.tensionMembers}; checked: ${p.checked}; over: ${p.over}; tight: ${p.tight}.`,
      '',
      `Open the results: ${p.link}`,
      cautionBlock(),
      signature,
    ].join('\n'),
  };
}

export function importFailedMail(p: { projectName: string; modelName: string; revisionNumber: number; reason: string; link: string }) {
  return {
    subject: `${JOB_STATUS_LABELS.failed}: ${p.modelName} r${p.revisionNumber} (${p.projectName})`,
    text: [`Revision ${p.revisionNumber} of "${p.modelName}" in ${p.projectName} could not be checked.`, '', `Reason: ${p.reason}`, '', `Project: ${p.link}`, signature].join('\n'),
  };
}

export function invitationMail(p: { name: string; invitedBy: string; link: string; expiresHours: number }) {
  return {
    subject: 'Your Gaugeline account',
    text: [
      `Hello ${p.name},`,
      '',
      `${p.invitedBy} has made you a Gaugeline account. Choose your password here (the link works once, for ${p.expiresHours} hours):`,
      p.link,
      signature,
    ].join('\n'),
  };
}

export function passwordResetMail(p: { name: string; link: string; expiresMinutes: number }) {
  return {
    subject: 'Choose a new Gaugeline password',
    text: [
      `Hello ${p.name},`,
      '',
      `Someone asked to reset the password of your Gaugeline account. If it was you, choose a new password here (the link works once, for ${p.expiresMinutes} minutes):`,
      p.link,
      '',
      'If it was not you, ignore this message; your password stays as it is.',
      signature,
    ].join('\n'),
  };
}

export function criticalMembersMail(p: { sender: string; projectName: string; modelName: string; revisionNumber: number; standard: string; message: string; count: number; filter: string; link: string }) {
  return {
    subject: `Critical members: ${p.modelName} r${p.revisionNumber} (${p.projectName})`,
    text: [
      p.message.trim(),
      '',
      `${p.sender} sends ${p.count} member(s) of revision ${p.revisionNumber} of "${p.modelName}" (${p.filter}), checked to ${STANDARD_LABELS[p.standard as StandardId] ?? p.standard}. The attached files list them by IFC GlobalId.`,
      `Open the results: ${p.link}`,
      cautionBlock(),
      signature,
    ].join('\n'),
  };
}
