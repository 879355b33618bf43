import { Fragment } from 'react';

/** An e-mail address that may wrap only before its dots and at-sign, never mid-word. */
export function Email({ address }: { address: string }) {
  const parts = address.split(/(?=[@.])/);
  return (
    <>
      {parts.map((part, i) => (
        <Fragment key={i}>
          {i > 0 ? <wbr /> : null}
          {part}
        </Fragment>
      ))}
    </>
  );
}
