/** The e-mails of the mill round, as plain text (every client reads it) with the link on its own line. */

export interface MailText {
  subject: string;
  text: string;
}

const sign = '\n\n— Needlemap, for the studio';

export function releaseMail(m: { studio: string; code: string; name: string; revision: number; mill: string; link: string; note: string; by: string }): MailText {
  return {
    subject: `${m.code} revision ${m.revision} released to ${m.mill}: mill pack ready`,
    text:
      `${m.by} at ${m.studio} has released ${m.code} ${m.name}, revision ${m.revision}, to ${m.mill}.\n\n` +
      (m.note ? `Note from the studio:\n${m.note}\n\n` : '') +
      `The mill pack (swatch sheets at true size, panels, yarns, sizes) and the textures to knit are here:\n${m.link}\n` +
      sign,
  };
}

export function reviewMail(m: { studio: string; code: string; name: string; revision: number; link: string; by: string }): MailText {
  return {
    subject: `${m.code} revision ${m.revision}: your approval is asked`,
    text:
      `${m.by} at ${m.studio} asks you to review ${m.code} ${m.name}, revision ${m.revision}: the body map, renders, label and colours.\n\n` +
      `Approve it, or ask for changes with a comment, here:\n${m.link}\n` +
      sign,
  };
}

export function reviewDecisionMail(m: { code: string; revision: number; client: string; decision: 'approved' | 'changes-requested'; comment: string; link: string }): MailText {
  const verb = m.decision === 'approved' ? 'approved' : 'asked for changes to';
  return {
    subject: `${m.code} revision ${m.revision}: ${m.client} ${verb} it`,
    text: `${m.client} ${verb} ${m.code} revision ${m.revision}.\n\n${m.comment ? `Comment:\n${m.comment}\n\n` : ''}${m.link}\n${sign}`,
  };
}

export function testKnitRequestMail(m: { code: string; revision: number; mill: string; textures: string[]; link: string }): MailText {
  return {
    subject: `${m.code} revision ${m.revision}: ${m.textures.length} test knit${m.textures.length === 1 ? '' : 's'} requested`,
    text:
      `Please knit a test piece of each texture of ${m.code} revision ${m.revision} and send back a photo with the measured wales/cm, courses/cm and g/m²:\n\n` +
      m.textures.map((t) => `  • ${t}`).join('\n') +
      `\n\nUpload them here:\n${m.link}\n${sign}`,
  };
}

export function testKnitSubmittedMail(m: { code: string; texture: string; mill: string; flagged: boolean; summary: string; link: string }): MailText {
  return {
    subject: `${m.code}: ${m.mill} sent the test knit of ${m.texture}${m.flagged ? ' (off plan)' : ''}`,
    text: `${m.mill} sent the test knit of ${m.texture}.\n\n${m.summary}\n\nDecide here:\n${m.link}\n${sign}`,
  };
}

export function testKnitDecisionMail(m: { code: string; texture: string; decision: 'approved' | 'change-requested'; comment: string; link: string }): MailText {
  const verb = m.decision === 'approved' ? 'approved' : 'needs a change';
  return {
    subject: `${m.code}: test knit of ${m.texture} ${verb}`,
    text: `The studio decided on the test knit of ${m.texture}: ${verb}.\n\n${m.comment ? `Comment:\n${m.comment}\n\n` : ''}${m.link}\n${sign}`,
  };
}
