<?xml version="1.0" encoding="utf-8"?>
<!DOCTYPE TS>
<TS version="2.1" language="de_DE">
<context>
    <name>MainWindow</name>
    <message>
        <source>Dispatch grid</source>
        <translation>Zuteilungsraster</translation>
    </message>
    <message>
        <source>Jobs as rows, machines as columns: each cell is the value of a job on a machine; Shift+F10 opens the actions of the current cell</source>
        <translation>Aufträge als Zeilen, Maschinen als Spalten: jede Zelle ist der Wert eines Auftrags auf einer Maschine; Umschalt+F10 öffnet die Aktionen der aktuellen Zelle</translation>
    </message>
    <message>
        <source>&amp;Grid</source>
        <translation>&amp;Raster</translation>
    </message>
    <message>
        <source>Plan</source>
        <translation>Plan</translation>
    </message>
    <message>
        <source>{planned} planned   {running} running   {pinned} pinned   {forbidden} forbidden   {cannot} cannot run   {down} machine down   {rush} rush</source>
        <translation>{planned} eingeplant   {running} läuft   {pinned} festgelegt   {forbidden} verboten   {cannot} nicht möglich   {down} Maschine ausgefallen   {rush} Eilauftrag</translation>
    </message>
    <message>
        <source>What the marks in the grid mean (colours repeat them)</source>
        <translation>Was die Zeichen im Raster bedeuten (die Farben wiederholen sie)</translation>
    </message>
    <message>
        <source>Legend of the grid&apos;s marks</source>
        <translation>Legende der Rasterzeichen</translation>
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
        <source>C&amp;rew</source>
        <translation>&amp;Personal</translation>
    </message>
    <message>
        <source>Views of the shop</source>
        <translation>Ansichten des Betriebs</translation>
    </message>
    <message>
        <source>The grid, the what-if map, the alternatives and the crew</source>
        <translation>Das Raster, die Was-wäre-wenn-Karte, die Alternativen und das Personal</translation>
    </message>
    <message>
        <source>The plan for the grid as it is now</source>
        <translation>Der Plan für das Raster, wie es jetzt ist</translation>
    </message>
    <message>
        <source>&amp;New</source>
        <translation>&amp;Neu</translation>
    </message>
    <message>
        <source>Start an empty shop</source>
        <translation>Einen leeren Betrieb beginnen</translation>
    </message>
    <message>
        <source>&amp;Open…</source>
        <translation>Ö&amp;ffnen…</translation>
    </message>
    <message>
        <source>Open a shop document or grid file</source>
        <translation>Ein Betriebsdokument oder eine Rasterdatei öffnen</translation>
    </message>
    <message>
        <source>&amp;Save</source>
        <translation>&amp;Speichern</translation>
    </message>
    <message>
        <source>Save the shop document</source>
        <translation>Das Betriebsdokument speichern</translation>
    </message>
    <message>
        <source>Save &amp;As…</source>
        <translation>Speichern &amp;unter…</translation>
    </message>
    <message>
        <source>Save under a new name</source>
        <translation>Unter einem neuen Namen speichern</translation>
    </message>
    <message>
        <source>&amp;Import grid (CSV/XLSX)…</source>
        <translation>Raster &amp;importieren (CSV/XLSX)…</translation>
    </message>
    <message>
        <source>Start a shop from a grid file</source>
        <translation>Einen Betrieb aus einer Rasterdatei beginnen</translation>
    </message>
    <message>
        <source>&amp;Export grid (CSV/XLSX)…</source>
        <translation>Raster &amp;exportieren (CSV/XLSX)…</translation>
    </message>
    <message>
        <source>Write the grid to a CSV or XLSX file</source>
        <translation>Das Raster in eine CSV- oder XLSX-Datei schreiben</translation>
    </message>
    <message>
        <source>Import grid &amp;into this shop…</source>
        <translation>Raster in diesen Betrieb ein&amp;lesen…</translation>
    </message>
    <message>
        <source>Merge a grid file into this shop by job and machine names</source>
        <translation>Eine Rasterdatei nach Auftrags- und Maschinennamen in diesen Betrieb übernehmen</translation>
    </message>
    <message>
        <source>Export p&amp;lan (CSV/XLSX)…</source>
        <translation>P&amp;lan exportieren (CSV/XLSX)…</translation>
    </message>
    <message>
        <source>Write the plan shown to a CSV or XLSX file</source>
        <translation>Den angezeigten Plan in eine CSV- oder XLSX-Datei schreiben</translation>
    </message>
    <message>
        <source>&amp;Quit</source>
        <translation>&amp;Beenden</translation>
    </message>
    <message>
        <source>Close the app</source>
        <translation>Die Anwendung schließen</translation>
    </message>
    <message>
        <source>&amp;Undo</source>
        <translation>&amp;Rückgängig</translation>
    </message>
    <message>
        <source>&amp;Redo</source>
        <translation>&amp;Wiederherstellen</translation>
    </message>
    <message>
        <source>&amp;Copy</source>
        <translation>&amp;Kopieren</translation>
    </message>
    <message>
        <source>Copy the selected values</source>
        <translation>Die ausgewählten Werte kopieren</translation>
    </message>
    <message>
        <source>Copy with &amp;names</source>
        <translation>Mit &amp;Namen kopieren</translation>
    </message>
    <message>
        <source>Copy the selection with job and machine names</source>
        <translation>Die Auswahl mit Auftrags- und Maschinennamen kopieren</translation>
    </message>
    <message>
        <source>&amp;Paste</source>
        <translation>E&amp;infügen</translation>
    </message>
    <message>
        <source>Paste a tab-separated block from a spreadsheet</source>
        <translation>Einen tabulatorgetrennten Block aus einer Tabellenkalkulation einfügen</translation>
    </message>
    <message>
        <source>Mark &amp;cannot run</source>
        <translation>Als &amp;nicht möglich markieren</translation>
    </message>
    <message>
        <source>The machine cannot run the job (selected cells)</source>
        <translation>Die Maschine kann den Auftrag nicht ausführen (ausgewählte Zellen)</translation>
    </message>
    <message>
        <source>&amp;Pin job to this machine</source>
        <translation>Auftrag auf diese Maschine &amp;festlegen</translation>
    </message>
    <message>
        <source>The job must go to this machine</source>
        <translation>Der Auftrag muss auf diese Maschine</translation>
    </message>
    <message>
        <source>&amp;Forbid this pair</source>
        <translation>Dieses Paar &amp;verbieten</translation>
    </message>
    <message>
        <source>The job must not go to this machine</source>
        <translation>Der Auftrag darf nicht auf diese Maschine</translation>
    </message>
    <message>
        <source>C&amp;lear pin</source>
        <translation>Festlegung &amp;aufheben</translation>
    </message>
    <message>
        <source>Remove the pin or ban of this pair</source>
        <translation>Die Festlegung oder das Verbot dieses Paares aufheben</translation>
    </message>
    <message>
        <source>&amp;Rush job arrived…</source>
        <translation>&amp;Eilauftrag eingetroffen…</translation>
    </message>
    <message>
        <source>Make the current job a rush job and re-dispatch</source>
        <translation>Den aktuellen Auftrag zum Eilauftrag machen und neu zuteilen</translation>
    </message>
    <message>
        <source>&amp;Add job…</source>
        <translation>Auftrag &amp;hinzufügen…</translation>
    </message>
    <message>
        <source>Add a job (for example a rush order that just arrived)</source>
        <translation>Einen Auftrag hinzufügen (zum Beispiel einen gerade eingetroffenen Eilauftrag)</translation>
    </message>
    <message>
        <source>Add &amp;machine…</source>
        <translation>&amp;Maschine hinzufügen…</translation>
    </message>
    <message>
        <source>Add a machine column</source>
        <translation>Eine Maschinenspalte hinzufügen</translation>
    </message>
    <message>
        <source>Mark job &amp;done</source>
        <translation>Auftrag als &amp;erledigt markieren</translation>
    </message>
    <message>
        <source>The current job is finished: it takes no part any more</source>
        <translation>Der aktuelle Auftrag ist fertig: er wird nicht mehr eingeplant</translation>
    </message>
    <message>
        <source>Job &amp;pulled…</source>
        <translation>Auftrag &amp;zurückgezogen…</translation>
    </message>
    <message>
        <source>The current job is cancelled or put on hold: re-dispatch without it and take it out of the shop</source>
        <translation>Der aktuelle Auftrag ist storniert oder zurückgestellt: ohne ihn neu zuteilen und ihn aus dem Betrieb nehmen</translation>
    </message>
    <message>
        <source>Set &amp;wait penalty…</source>
        <translation>&amp;Wartekosten festlegen…</translation>
    </message>
    <message>
        <source>Cost of leaving the current job waiting</source>
        <translation>Kosten, wenn der aktuelle Auftrag warten muss</translation>
    </message>
    <message>
        <source>Machine &amp;down…</source>
        <translation>Maschine &amp;ausgefallen…</translation>
    </message>
    <message>
        <source>Mark the current machine down and re-dispatch</source>
        <translation>Die aktuelle Maschine als ausgefallen markieren und neu zuteilen</translation>
    </message>
    <message>
        <source>Machine back &amp;up…</source>
        <translation>Maschine wieder &amp;bereit…</translation>
    </message>
    <message>
        <source>Mark the current machine up again and re-dispatch</source>
        <translation>Die aktuelle Maschine wieder als bereit markieren und neu zuteilen</translation>
    </message>
    <message>
        <source>Machine in &amp;maintenance</source>
        <translation>Maschine in &amp;Wartung</translation>
    </message>
    <message>
        <source>The current machine takes no jobs (planned maintenance)</source>
        <translation>Die aktuelle Maschine nimmt keine Aufträge an (geplante Wartung)</translation>
    </message>
    <message>
        <source>Set &amp;slots…</source>
        <translation>&amp;Plätze festlegen…</translation>
    </message>
    <message>
        <source>How many jobs the current machine takes per round</source>
        <translation>Wie viele Aufträge die aktuelle Maschine je Runde übernimmt</translation>
    </message>
    <message>
        <source>&amp;Put plan in force…</source>
        <translation>Plan in &amp;Kraft setzen…</translation>
    </message>
    <message>
        <source>Record the plan shown as the decision in force</source>
        <translation>Den angezeigten Plan als gültige Entscheidung erfassen</translation>
    </message>
    <message>
        <source>Re-&amp;solve now</source>
        <translation>Jetzt neu &amp;berechnen</translation>
    </message>
    <message>
        <source>Solve again</source>
        <translation>Erneut berechnen</translation>
    </message>
    <message>
        <source>&amp;Cancel solve</source>
        <translation>Berechnung ab&amp;brechen</translation>
    </message>
    <message>
        <source>Stop waiting for a long solve</source>
        <translation>Nicht länger auf eine lange Berechnung warten</translation>
    </message>
    <message>
        <source>Least &amp;total</source>
        <translation>Geringste &amp;Summe</translation>
    </message>
    <message>
        <source>Most &amp;value</source>
        <translation>Größter &amp;Wert</translation>
    </message>
    <message>
        <source>Smallest &amp;largest value</source>
        <translation>Kleinster &amp;größter Wert</translation>
    </message>
    <message>
        <source>Objective: {objective}</source>
        <translation>Ziel: {objective}</translation>
    </message>
    <message>
        <source>One round: one job per free machine slot</source>
        <translation>Eine Runde: ein Auftrag je freiem Maschinenplatz</translation>
    </message>
    <message>
        <source>Whole shift: several jobs per machine within its hours</source>
        <translation>Ganze Schicht: mehrere Aufträge je Maschine innerhalb ihrer Stunden</translation>
    </message>
    <message>
        <source>One &amp;round (one job per machine)</source>
        <translation>Eine &amp;Runde (ein Auftrag je Maschine)</translation>
    </message>
    <message>
        <source>Whole &amp;shift (several jobs per machine)</source>
        <translation>Ganze &amp;Schicht (mehrere Aufträge je Maschine)</translation>
    </message>
    <message>
        <source>Print pre&amp;view…</source>
        <translation>Druck&amp;vorschau…</translation>
    </message>
    <message>
        <source>See the dispatch sheet as it will print</source>
        <translation>Das Zuteilungsblatt so sehen, wie es gedruckt wird</translation>
    </message>
    <message>
        <source>&amp;Print sheet…</source>
        <translation>Blatt &amp;drucken…</translation>
    </message>
    <message>
        <source>Print the dispatch sheet</source>
        <translation>Das Zuteilungsblatt drucken</translation>
    </message>
    <message>
        <source>Export sheet as P&amp;DF…</source>
        <translation>Blatt als PD&amp;F exportieren…</translation>
    </message>
    <message>
        <source>Write the dispatch sheet to a PDF</source>
        <translation>Das Zuteilungsblatt in eine PDF-Datei schreiben</translation>
    </message>
    <message>
        <source>Se&amp;ttings…</source>
        <translation>Ein&amp;stellungen…</translation>
    </message>
    <message>
        <source>History file, default supervisor name, autosave interval</source>
        <translation>Verlaufsdatei, vorgegebener Name der Schichtleitung, Intervall der automatischen Sicherung</translation>
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
    <message>
        <source>Untitled</source>
        <translation>Unbenannt</translation>
    </message>
    <message>
        <source>Plan in force: {what}. Any edit re-solves from scratch.</source>
        <translation>Gültiger Plan: {what}. Jede Änderung berechnet von Grund auf neu.</translation>
    </message>
    <message>
        <source>internal error while solving: {error}</source>
        <translation>interner Fehler bei der Berechnung: {error}</translation>
    </message>
    <message>
        <source>Solving failed: {error}</source>
        <translation>Berechnung fehlgeschlagen: {error}</translation>
    </message>
    <message>
        <source>Shop documents (*{suffix});;Grid files ({grids});;All files (*)</source>
        <translation>Betriebsdokumente (*{suffix});;Rasterdateien ({grids});;Alle Dateien (*)</translation>
    </message>
    <message>
        <source>Grid files ({grids})</source>
        <translation>Rasterdateien ({grids})</translation>
    </message>
    <message>
        <source>Open</source>
        <translation>Öffnen</translation>
    </message>
    <message>
        <source>Import grid</source>
        <translation>Raster importieren</translation>
    </message>
    <message>
        <source>Save shop</source>
        <translation>Betrieb speichern</translation>
    </message>
    <message>
        <source>Shop documents (*{suffix})</source>
        <translation>Betriebsdokumente (*{suffix})</translation>
    </message>
    <message>
        <source>Export grid</source>
        <translation>Raster exportieren</translation>
    </message>
    <message>
        <source>Import grid into this shop</source>
        <translation>Raster in diesen Betrieb einlesen</translation>
    </message>
    <message>
        <source>there is no plan to export yet</source>
        <translation>es gibt noch keinen Plan zum Exportieren</translation>
    </message>
    <message>
        <source>Export plan</source>
        <translation>Plan exportieren</translation>
    </message>
    <message>
        <source>Plan (*.csv *.xlsx)</source>
        <translation>Plan (*.csv *.xlsx)</translation>
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
