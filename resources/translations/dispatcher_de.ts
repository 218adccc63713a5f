<?xml version="1.0" encoding="utf-8"?>
<!DOCTYPE TS>
<TS version="2.1" language="de_DE">
<context>
    <name>MainWindow</name>
    <message>
        <source>&amp;Grid</source>
        <translation>&amp;Raster</translation>
    </message>
    <message>
        <source>&amp;What-if map</source>
        <translation>&amp;Was-wäre-wenn</translation>
    </message>
    <message>
        <source>&amp;Alternatives</source>
        <translation>A&amp;lternativen</translation>
    </message>
    <message>
        <source>&amp;File</source>
        <translation>&amp;Datei</translation>
    </message>
    <message>
        <source>Open &amp;recent</source>
        <translation>&amp;Zuletzt geöffnet</translation>
    </message>
    <message>
        <source>&amp;Edit</source>
        <translation>&amp;Bearbeiten</translation>
    </message>
    <message>
        <source>&amp;Job</source>
        <translation>&amp;Auftrag</translation>
    </message>
    <message>
        <source>&amp;Machine</source>
        <translation>&amp;Maschine</translation>
    </message>
    <message>
        <source>&amp;Plan</source>
        <translation>&amp;Plan</translation>
    </message>
    <message>
        <source>&amp;View</source>
        <translation>A&amp;nsicht</translation>
    </message>
</context>
<context>
    <name>Sheet</name>
    <message>
        <source>no available machine can run it</source>
        <extracomment>How a waiting reason starts when no machine can take the job (shop.translate&apos;s words).</extracomment>
        <translation>keine verfügbare Maschine kann ihn ausführen</translation>
    </message>
    <message>
        <source>(unnamed shop)</source>
        <extracomment>Printed for a shop without a name.</extracomment>
        <translation>(Betrieb ohne Namen)</translation>
    </message>
    <message>
        <source>Value</source>
        <translation>Wert</translation>
    </message>
    <message>
        <source>Cost</source>
        <translation>Kosten</translation>
    </message>
    <message>
        <source>Setup</source>
        <translation>Rüstzeit</translation>
    </message>
    <message>
        <source>least total cost</source>
        <translation>geringste Gesamtkosten</translation>
    </message>
    <message>
        <source>smallest largest cost, then least total</source>
        <translation>kleinste Einzelkosten, dann geringste Summe</translation>
    </message>
    <message>
        <source>least total setup</source>
        <translation>geringste gesamte Rüstzeit</translation>
    </message>
    <message>
        <source>smallest largest setup, then least total</source>
        <translation>kürzeste längste Rüstzeit, dann geringste Summe</translation>
    </message>
    <message>
        <source>greatest total value</source>
        <translation>größter Gesamtwert</translation>
    </message>
    <message>
        <source>proven optimal</source>
        <translation>bewiesen optimal</translation>
    </message>
    <message>
        <source>optimal, proven by its certificate</source>
        <translation>optimal, durch sein Zertifikat bewiesen</translation>
    </message>
    <message>
        <source>not placed in this round</source>
        <translation>in dieser Runde nicht eingeplant</translation>
    </message>
    <message>
        <source>Apply lockout/tagout before any work on a machine that is down.</source>
        <extracomment>The cautions printed at the foot of every page. Wording is ours; the points are the ones every sheet must carry (see the Safety section of the README).</extracomment>
        <translation>Vor jeder Arbeit an einer ausgefallenen Maschine Verriegeln und Kennzeichnen (LOTO) anwenden.</translation>
    </message>
    <message>
        <source>Only operators trained and authorised for a machine may run it, whatever this sheet says.</source>
        <translation>Eine Maschine dürfen nur dafür geschulte und befugte Bediener führen, gleich was dieses Blatt sagt.</translation>
    </message>
    <message>
        <source>Follow the machine&apos;s own setup instructions for every changeover.</source>
        <translation>Bei jedem Umrüsten die Rüstanweisung der Maschine befolgen.</translation>
    </message>
    <message>
        <source>Site safety rules and local regulations take precedence over this sheet.</source>
        <translation>Die Sicherheitsregeln des Standorts und die örtlichen Vorschriften haben Vorrang vor diesem Blatt.</translation>
    </message>
    <message>
        <source>Up</source>
        <extracomment>Machine states as printed. Words, never colour, carry the meaning.</extracomment>
        <translation>Bereit</translation>
    </message>
    <message>
        <source>DOWN</source>
        <translation>AUSGEFALLEN</translation>
    </message>
    <message>
        <source>MAINTENANCE</source>
        <translation>WARTUNG</translation>
    </message>
    <message>
        <source>Up</source>
        <comment>state column</comment>
        <extracomment>Paper names accepted by ``--paper`` and :func:`write_pdf`. Territories where US Letter is the usual office paper (common practice: the Americas that follow the US paper series, and the Philippines); everywhere else uses ISO A4. Page margins in millimetres (inside most printers&apos; unprintable border). Rules and padding of the body tables, in Qt text-layout pixels (see _layout_px_per_pt); ``{rule}`` and ``{tall}`` are filled in for the device.</extracomment>
        <translation>Bereit</translation>
    </message>
    <message>
        <source>DOWN</source>
        <comment>state column</comment>
        <translation>AUSGEF.</translation>
    </message>
    <message>
        <source>MAINT.</source>
        <comment>state column</comment>
        <translation>WART.</translation>
    </message>
    <message>
        <source>Machines and jobs ({machines}, {jobs})</source>
        <translation>Maschinen und Aufträge ({machines}, {jobs})</translation>
    </message>
    <message numerus="yes">
        <source>%n machine(s)</source>
        <translation>
            <numerusform>%n Maschine</numerusform>
            <numerusform>%n Maschinen</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>%n job(s)</source>
        <translation>
            <numerusform>%n Auftrag</numerusform>
            <numerusform>%n Aufträge</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>Waiting jobs (%n)</source>
        <translation>
            <numerusform>Wartende Aufträge (%n)</numerusform>
            <numerusform>Wartende Aufträge (%n)</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>Machines down (%n) - lockout/tagout before any work</source>
        <translation>
            <numerusform>Ausgefallene Maschinen (%n) - vor jeder Arbeit Verriegeln und Kennzeichnen (LOTO)</numerusform>
            <numerusform>Ausgefallene Maschinen (%n) - vor jeder Arbeit Verriegeln und Kennzeichnen (LOTO)</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>%n slot(s)</source>
        <translation>
            <numerusform>%n Platz</numerusform>
            <numerusform>%n Plätze</numerusform>
        </translation>
    </message>
    <message>
        <source>{machines} ({down} down, {idle} idle)</source>
        <translation>{machines} ({down} ausgefallen, {idle} ohne Auftrag)</translation>
    </message>
    <message numerus="yes">
        <source>%n job(s) can only run on {machines}</source>
        <translation>
            <numerusform>%n Auftrag kann nur auf {machines} laufen</numerusform>
            <numerusform>%n Aufträge können nur auf {machines} laufen</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>so %n of them must wait</source>
        <translation>
            <numerusform>also muss %n davon warten</numerusform>
            <numerusform>also müssen %n davon warten</numerusform>
        </translation>
    </message>
    <message>
        <source>Machine</source>
        <extracomment>Main table columns: (key, width in percent of the text width); headings in _heading.</extracomment>
        <translation>Maschine</translation>
    </message>
    <message>
        <source>State</source>
        <translation>Status</translation>
    </message>
    <message>
        <source>Seq.</source>
        <translation>Nr.</translation>
    </message>
    <message>
        <source>Work order</source>
        <translation>Arbeits­auftrag</translation>
    </message>
    <message>
        <source>Job</source>
        <translation>Auftrag</translation>
    </message>
    <message>
        <source>Notes</source>
        <translation>Hinweise</translation>
    </message>
    <message>
        <source>Initials</source>
        <translation>Kürzel</translation>
    </message>
    <message>
        <source>Start</source>
        <translation>Beginn</translation>
    </message>
    <message>
        <source>Finish</source>
        <translation>Ende</translation>
    </message>
    <message>
        <source>Operator</source>
        <translation>Bediener</translation>
    </message>
    <message>
        <source>RUSH</source>
        <translation>EILT</translation>
    </message>
    <message>
        <source>carries on</source>
        <translation>läuft weiter</translation>
    </message>
    <message>
        <source>running since {time}</source>
        <translation>läuft seit {time}</translation>
    </message>
    <message>
        <source>run {hours}</source>
        <translation>Laufzeit {hours}</translation>
    </message>
    <message>
        <source>h</source>
        <translation>h</translation>
    </message>
    <message>
        <source>pinned here</source>
        <translation>hier festgelegt</translation>
    </message>
    <message>
        <source>no work: see Machines down</source>
        <extracomment>The same with the operator of each machine beside the initials box (shops with a crew).</extracomment>
        <translation>keine Arbeit: siehe Ausgefallene Maschinen</translation>
    </message>
    <message>
        <source>idle: no job this round</source>
        <translation>frei: kein Auftrag in dieser Runde</translation>
    </message>
    <message>
        <source>{k} of {count}</source>
        <translation>{k} von {count}</translation>
    </message>
    <message>
        <source>No machines in this shop.</source>
        <translation>Dieser Betrieb hat keine Maschinen.</translation>
    </message>
    <message>
        <source>Why it waits</source>
        <translation>Warum er wartet</translation>
    </message>
    <message>
        <source>same reason as {job}</source>
        <translation>gleicher Grund wie {job}</translation>
    </message>
    <message>
        <source>No job waits.</source>
        <translation>Kein Auftrag wartet.</translation>
    </message>
    <message>
        <source>Since</source>
        <translation>Seit</translation>
    </message>
    <message>
        <source>Note</source>
        <translation>Hinweis</translation>
    </message>
    <message>
        <source>No machine is down.</source>
        <translation>Keine Maschine ist ausgefallen.</translation>
    </message>
    <message>
        <source>Plan total</source>
        <translation>Plansumme</translation>
    </message>
    <message>
        <source>Machines</source>
        <translation>Maschinen</translation>
    </message>
    <message>
        <source>Jobs dispatched</source>
        <translation>Zugeteilte Aufträge</translation>
    </message>
    <message>
        <source>Jobs already running (carry on)</source>
        <translation>Bereits laufende Aufträge (laufen weiter)</translation>
    </message>
    <message>
        <source>Jobs waiting</source>
        <translation>Wartende Aufträge</translation>
    </message>
    <message>
        <source>Plan status</source>
        <translation>Planstatus</translation>
    </message>
    <message>
        <source>Totals</source>
        <translation>Summen</translation>
    </message>
    <message>
        <source>Supervisor</source>
        <translation>Schicht­leitung</translation>
    </message>
    <message>
        <source>Signature</source>
        <translation>Unterschrift</translation>
    </message>
    <message>
        <source>Time</source>
        <translation>Zeit</translation>
    </message>
    <message>
        <source>Sign-off</source>
        <translation>Freigabe</translation>
    </message>
    <message>
        <source>About this shop: {note}</source>
        <translation>Zu diesem Betrieb: {note}</translation>
    </message>
    <message>
        <source>Dispatch sheet - {shop}</source>
        <translation>Zuteilungsblatt - {shop}</translation>
    </message>
    <message>
        <source>Decision #{number} of {time}</source>
        <translation>Entscheidung Nr. {number} vom {time}</translation>
    </message>
    <message>
        <source>Decision #{number}</source>
        <translation>Entscheidung Nr. {number}</translation>
    </message>
    <message>
        <source>Decision: {not_recorded} (draft plan)</source>
        <translation>Entscheidung: {not_recorded} (Planentwurf)</translation>
    </message>
    <message>
        <source>not recorded</source>
        <translation>nicht erfasst</translation>
    </message>
    <message>
        <source>Date</source>
        <translation>Datum</translation>
    </message>
    <message>
        <source>Shift</source>
        <translation>Schicht</translation>
    </message>
    <message>
        <source>Printed {time}</source>
        <translation>Gedruckt {time}</translation>
    </message>
    <message>
        <source>Page {page} of {pages}</source>
        <translation>Seite {page} von {pages}</translation>
    </message>
    <message>
        <source>SAFETY:</source>
        <translation>SICHERHEIT:</translation>
    </message>
</context>
</TS>
