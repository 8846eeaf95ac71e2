import type { ReactNode } from "react";
import { Document, Image, Page, View } from "@react-pdf/renderer";
import { Text } from "./text.tsx";
import { format } from "date-fns";
import { s } from "./theme.ts";
import { pageFooterText } from "./host-tree.ts";

export type DocMeta = {
  studioName: string;
  studioAddress: string | null;
  /** Telephone and e-mail, as the studio gave them; absent or null for none. */
  studioContact?: string | null;
  kindLabel: string;
  objectNumber?: string | null;
  code: string;
  issuedAt: Date;
  paperSize: "A4" | "Letter";
  title: string;
  /** The studio's logo as PNG bytes, drawn left of the studio's name; null or absent for none. */
  logo?: Buffer | null;
};

/** The left of the header band: the logo (if any), then the studio's name and address. */
export function StudioBlock({ meta }: { meta: DocMeta }) {
  return (
    <View style={{ flexDirection: "row", alignItems: "center" }}>
      {meta.logo ? <Image src={meta.logo} style={{ height: 28, maxWidth: 120, marginRight: 8, objectFit: "contain" }} /> : null}
      <View>
        <Text style={s.studio}>{meta.studioName}</Text>
        {meta.studioAddress ? <Text style={s.small}>{meta.studioAddress}</Text> : null}
        {meta.studioContact ? <Text style={s.small}>{meta.studioContact}</Text> : null}
      </View>
    </View>
  );
}

/** Every document: a header band with the studio, the document's kind, the object number and the verification code; a footer with the date, page x of y and "Produced by Reversa". */
export function DocShell({ meta, children, size }: { meta: DocMeta; children: ReactNode; size?: "A4" | "LETTER" | [number, number] }) {
  const pageSize = size ?? (meta.paperSize === "Letter" ? "LETTER" : "A4");
  return (
    <Document title={meta.title} author={meta.studioName} creator="Reversa" producer="Reversa">
      <Page size={pageSize} style={s.page} wrap>
        <View style={s.header} fixed>
          <StudioBlock meta={meta} />
          <View>
            <Text style={s.kind}>{meta.kindLabel}</Text>
            <Text style={[s.small, { textAlign: "right" }]}>
              {meta.objectNumber ? `Object ${meta.objectNumber} · ` : ""}Verification code {meta.code}
            </Text>
          </View>
        </View>
        {children}
        <Text style={[s.footer, { left: 40 }]} fixed>
          Issued {format(meta.issuedAt, "d MMM yyyy, HH:mm")} · verify the code {meta.code} in Reversa (/verify)
        </Text>
        {/* lineHeight on the page would blank this dynamic text (react-pdf 4), so it is set on text blocks instead. */}
        <Text style={[s.footer, { left: 360, textAlign: "right", borderTopWidth: 0 }]} fixed render={pageFooterText} />
      </Page>
    </Document>
  );
}

export function Field({ label, children }: { label: string; children: ReactNode }) {
  if (children === null || children === undefined || children === "") return null;
  return (
    <View style={s.row} wrap={false}>
      <Text style={s.label}>{label}</Text>
      <Text style={s.value}>{children}</Text>
    </View>
  );
}
