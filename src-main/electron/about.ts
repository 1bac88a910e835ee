/** What the About box says: the version, where the data are kept, and the licence. */
export interface AboutFacts {
  productName: string;
  version: string;
  dataDirectory: string;
  /** package.json's `license` (an SPDX id, or UNLICENSED). */
  licence: string | undefined;
  electronVersion: string | undefined;
}

export function aboutMessage(facts: AboutFacts): { title: string; message: string; detail: string } {
  const licence =
    facts.licence === undefined || facts.licence === 'UNLICENSED'
      ? 'Licence: none granted (all rights reserved by the Tallyline authors).'
      : `Licence: ${facts.licence}.`;
  const runtime = facts.electronVersion ? `Electron ${facts.electronVersion}; third-party licences in LICENSES.chromium.html beside the program.` : '';
  return {
    title: `About ${facts.productName}`,
    message: `${facts.productName} ${facts.version}`,
    detail: [`Data folder: ${facts.dataDirectory}`, licence, runtime].filter((line) => line !== '').join('\n'),
  };
}
