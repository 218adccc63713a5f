<?xml version="1.0" encoding="utf-8"?>
<!DOCTYPE TS>
<TS version="2.1" language="de_DE">
<context>
    <name>AlternativesTab</name>
    <message>
        <source>ranking plans failed: {error}</source>
        <translation>Rangfolge der Pläne fehlgeschlagen: {error}</translation>
    </message>
    <message>
        <source>Ranking cancelled</source>
        <translation>Rangfolge abgebrochen</translation>
    </message>
    <message>
        <source>No plan yet</source>
        <translation>Noch kein Plan</translation>
    </message>
    <message>
        <source>Alternatives are ranked for one dispatch round (Plan menu: One round)</source>
        <translation>Alternativen werden für eine Zuteilungsrunde gereiht (Menü Plan: Eine Runde)</translation>
    </message>
    <message>
        <source>Alternatives are ranked for the &apos;least total&apos; and &apos;most value&apos; objectives</source>
        <translation>Alternativen werden für die Ziele &apos;Geringste Summe&apos; und &apos;Größter Wert&apos; gereiht</translation>
    </message>
    <message>
        <source>Ranking plans…</source>
        <translation>Pläne werden gereiht…</translation>
    </message>
    <message>
        <source>Put plan #{rank} of the alternatives in force</source>
        <translation>Plan Nr. {rank} der Alternativen in Kraft setzen</translation>
    </message>
</context>
<context>
    <name>AlternativesView</name>
    <message>
        <source>The best plans to list, best first</source>
        <translation>Die besten Pläne, die aufgelistet werden, der beste zuerst</translation>
    </message>
    <message>
        <source>How many plans</source>
        <translation>Wie viele Pläne</translation>
    </message>
    <message>
        <source>Find best plans</source>
        <translation>Beste Pläne finden</translation>
    </message>
    <message>
        <source>Rank the best plans of the shop as it is now</source>
        <translation>Die besten Pläne für den Betrieb, wie er jetzt ist, reihen</translation>
    </message>
    <message>
        <source>Ranking status</source>
        <translation>Stand der Rangfolge</translation>
    </message>
    <message>
        <source>How many plans were found, or why none</source>
        <translation>Wie viele Pläne gefunden wurden, oder warum keiner</translation>
    </message>
    <message>
        <source>Ranked plans</source>
        <translation>Gereihte Pläne</translation>
    </message>
    <message>
        <source>The best plans, best first, with their gap to the best</source>
        <translation>Die besten Pläne, der beste zuerst, mit ihrem Abstand zum besten</translation>
    </message>
    <message>
        <source>Plan details</source>
        <translation>Einzelheiten des Plans</translation>
    </message>
    <message>
        <source>The selected plan and what it changes against the best</source>
        <translation>Der ausgewählte Plan und was er gegenüber dem besten ändert</translation>
    </message>
    <message>
        <source>How man&amp;y plans:</source>
        <translation>&amp;Wie viele Pläne:</translation>
    </message>
    <message>
        <source>Find best pla&amp;ns</source>
        <translation>Beste Pläne &amp;finden</translation>
    </message>
    <message>
        <source>Put this plan &amp;in force…</source>
        <translation>Diesen Plan in &amp;Kraft setzen…</translation>
    </message>
    <message>
        <source>Put this plan in force</source>
        <translation>Diesen Plan in Kraft setzen</translation>
    </message>
    <message>
        <source>Confirm and record the selected plan as the decision in force</source>
        <translation>Den ausgewählten Plan als gültige Entscheidung bestätigen und erfassen</translation>
    </message>
    <message>
        <source>No plan to rank</source>
        <translation>Kein Plan zum Reihen</translation>
    </message>
    <message>
        <source>less value</source>
        <translation>weniger Wert</translation>
    </message>
    <message>
        <source>more</source>
        <translation>mehr</translation>
    </message>
    <message>
        <source>#{rank}  total {total} {unit}  (best)</source>
        <translation>Nr. {rank}  Summe {total} {unit}  (bester)</translation>
    </message>
    <message>
        <source>#{rank}  total {total} {unit}  (+{gap} {more})</source>
        <translation>Nr. {rank}  Summe {total} {unit}  (+{gap} {more})</translation>
    </message>
    <message>
        <source>Plan #{rank}: total {total} {unit}; the optimal plan</source>
        <translation>Plan Nr. {rank}: Summe {total} {unit}; der optimale Plan</translation>
    </message>
    <message>
        <source>Plan #{rank}: total {total} {unit}; {gap} {more} than the best</source>
        <translation>Plan Nr. {rank}: Summe {total} {unit}; {gap} {more} als der beste</translation>
    </message>
    <message numerus="yes">
        <source>%n distinct plan(s) found near the best (machines that take several jobs repeat the same plan in other slots), best first</source>
        <translation>
            <numerusform>%n verschiedener Plan nahe am besten gefunden (Maschinen mit mehreren Aufträgen wiederholen denselben Plan in anderen Plätzen), der beste zuerst</numerusform>
            <numerusform>%n verschiedene Pläne nahe am besten gefunden (Maschinen mit mehreren Aufträgen wiederholen denselben Plan in anderen Plätzen), der beste zuerst</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>%n best plan(s), best first</source>
        <translation>
            <numerusform>%n bester Plan, der beste zuerst</numerusform>
            <numerusform>%n beste Pläne, der beste zuerst</numerusform>
        </translation>
    </message>
    <message>
        <source>Plan #{rank}: total {total}</source>
        <translation>Plan Nr. {rank}: Summe {total}</translation>
    </message>
    <message>
        <source>Waiting: {jobs}</source>
        <translation>Wartend: {jobs}</translation>
    </message>
    <message>
        <source>Against the best plan:</source>
        <translation>Gegenüber dem besten Plan:</translation>
    </message>
</context>
<context>
    <name>Asking</name>
    <message>
        <source>Use this value</source>
        <translation>Diesen Wert übernehmen</translation>
    </message>
    <message>
        <source>Close without changing anything</source>
        <translation>Schließen, ohne etwas zu ändern</translation>
    </message>
</context>
<context>
    <name>ChangeoverModel</name>
    <message>
        <source>the clipboard holds no text to paste</source>
        <translation>die Zwischenablage enthält keinen Text zum Einfügen</translation>
    </message>
    <message>
        <source>pasted block: row {row}, column 1: {label} is not a family of this table</source>
        <translation>eingefügter Block: Zeile {row}, Spalte 1: {label} ist keine Familie dieser Tabelle</translation>
    </message>
    <message>
        <source>pasted block: {rows} x {width} cells do not fit from the current cell: the table has {free_rows} rows and {free_columns} columns from there</source>
        <translation>eingefügter Block: {rows} x {width} Zellen passen nicht ab der aktuellen Zelle: die Tabelle hat von dort {free_rows} Zeilen und {free_columns} Spalten</translation>
    </message>
    <message>
        <source>pasted block: row {row}, column {column} (change from {a} to {b}): {problem}</source>
        <translation>eingefügter Block: Zeile {row}, Spalte {column} (Wechsel von {a} auf {b}): {problem}</translation>
    </message>
    <message>
        <source>nothing mounted</source>
        <translation>nichts gerüstet</translation>
    </message>
    <message>
        <source>Change from {a} to {b}: not allowed (a job of {b} cannot follow {a} on these machines); type a number to allow it</source>
        <translation>Wechsel von {a} zu {b}: nicht erlaubt (ein Auftrag von {b} kann auf diesen Maschinen nicht auf {a} folgen); eine Zahl eintragen, um ihn zu erlauben</translation>
    </message>
    <message>
        <source>No change: {b} stays mounted, {value} ({unit})</source>
        <translation>Kein Wechsel: {b} bleibt gerüstet, {value} ({unit})</translation>
    </message>
    <message>
        <source>Change from {a} to {b}: {value} ({unit}); empty: not allowed</source>
        <translation>Wechsel von {a} zu {b}: {value} ({unit}); leer: nicht erlaubt</translation>
    </message>
    <message>
        <source>to {family}</source>
        <translation>zu {family}</translation>
    </message>
    <message>
        <source>Changes to family {family}</source>
        <translation>Wechsel zur Familie {family}</translation>
    </message>
    <message>
        <source>from {family}</source>
        <translation>von {family}</translation>
    </message>
    <message>
        <source>Changes from family {family} (mounted now)</source>
        <translation>Wechsel von der Familie {family} (jetzt gerüstet)</translation>
    </message>
    <message>
        <source>Changes from an empty or cleaned machine</source>
        <translation>Wechsel von einer leeren oder gereinigten Maschine</translation>
    </message>
    <message>
        <source>{table}: change from {a} to {b}: {problem}</source>
        <translation>{table}: Wechsel von {a} zu {b}: {problem}</translation>
    </message>
    <message>
        <source>not allowed</source>
        <translation>nicht erlaubt</translation>
    </message>
    <message>
        <source>Change from {a} to {b} = {value}</source>
        <translation>Wechsel von {a} zu {b} = {value}</translation>
    </message>
    <message>
        <source>this shop has no changeover table to paste into</source>
        <translation>dieser Betrieb hat keine Rüsttabelle zum Einfügen</translation>
    </message>
    <message numerus="yes">
        <source>Paste %n changeover(s)</source>
        <translation>
            <numerusform>%n Rüstwechsel einfügen</numerusform>
            <numerusform>%n Rüstwechsel einfügen</numerusform>
        </translation>
    </message>
</context>
<context>
    <name>ChangeoverTab</name>
    <message>
        <source>Changeover tables</source>
        <translation>Rüsttabellen</translation>
    </message>
    <message>
        <source>The time or cost of changing a group of machines from one setup family to another</source>
        <translation>Zeit oder Kosten, um eine Maschinengruppe von einer Rüstfamilie auf eine andere umzurüsten</translation>
    </message>
    <message>
        <source>Changeover table</source>
        <translation>Rüsttabelle</translation>
    </message>
    <message>
        <source>Which changeover table the grid below edits</source>
        <translation>Welche Rüsttabelle das Raster darunter bearbeitet</translation>
    </message>
    <message>
        <source>&amp;Table:</source>
        <translation>&amp;Tabelle:</translation>
    </message>
    <message>
        <source>Changeover grid</source>
        <translation>Rüstraster</translation>
    </message>
    <message>
        <source>Rows: the family mounted now, last the nothing-mounted row; columns: the family changed to; an empty cell means the change is not allowed</source>
        <translation>Zeilen: die jetzt gerüstete Familie, zuletzt die Zeile für nichts gerüstet; Spalten: die Familie, auf die gewechselt wird; eine leere Zelle heißt, der Wechsel ist nicht erlaubt</translation>
    </message>
    <message>
        <source>This shop has no changeover table: every value is typed in the grid. Import one with dispatcher import-jobs --changeovers FILE.</source>
        <translation>Dieser Betrieb hat keine Rüsttabelle: jeder Wert wird im Raster getippt. Eine Tabelle importiert dispatcher import-jobs --changeovers FILE.</translation>
    </message>
    <message>
        <source>Changes need not add up: a change through a wash-up can be cheaper than the direct one, and the plans never assume otherwise. Follow each machine&apos;s setup instructions.</source>
        <translation>Wechsel müssen sich nicht addieren: ein Wechsel über eine Reinigung kann günstiger sein als der direkte, und die Pläne setzen nichts anderes voraus. Die Rüstanweisungen jeder Maschine befolgen.</translation>
    </message>
    <message>
        <source>Shared by: {machines}</source>
        <translation>Gemeinsam für: {machines}</translation>
    </message>
    <message>
        <source>paste into the changeover table refused: {problem}; nothing changed</source>
        <translation>Einfügen in die Rüsttabelle abgelehnt: {problem}; nichts geändert</translation>
    </message>
    <message numerus="yes">
        <source>Pasted; %n changeover(s) changed</source>
        <translation>
            <numerusform>Eingefügt; %n Rüstwechsel geändert</numerusform>
            <numerusform>Eingefügt; %n Rüstwechsel geändert</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>Disallow %n changeover(s)</source>
        <translation>
            <numerusform>%n Rüstwechsel verbieten</numerusform>
            <numerusform>%n Rüstwechsel verbieten</numerusform>
        </translation>
    </message>
</context>
<context>
    <name>Clipboard</name>
    <message>
        <source>pasted block</source>
        <translation>eingefügter Block</translation>
    </message>
    <message>
        <source>the clipboard holds no text to paste</source>
        <translation>die Zwischenablage enthält keinen Text zum Einfügen</translation>
    </message>
    <message>
        <source>{source}: job(s) not in this shop: {jobs}</source>
        <translation>{source}: Auftrag/Aufträge nicht in diesem Betrieb: {jobs}</translation>
    </message>
    <message>
        <source>{source}: {rows} x {width} cells do not fit from {job} / {machine}: the grid has {free_rows} rows and {free_columns} machine columns from there</source>
        <translation>{source}: {rows} x {width} Zellen passen nicht ab {job} / {machine}: das Raster hat von dort {free_rows} Zeilen und {free_columns} Maschinenspalten</translation>
    </message>
    <message>
        <source>row {row}, column {column}: </source>
        <translation>Zeile {row}, Spalte {column}: </translation>
    </message>
    <message>
        <source>row {row}: </source>
        <translation>Zeile {row}: </translation>
    </message>
</context>
<context>
    <name>CrewDelegate</name>
    <message>
        <source>HH:MM</source>
        <extracomment>Widest the notes column starts (the full notes are in the tooltip and the dialog).</extracomment>
        <translation>HH:MM</translation>
    </message>
</context>
<context>
    <name>CrewModel</name>
    <message>
        <source>Operator</source>
        <extracomment>Heads of the leading columns (English; the model shows them translated).</extracomment>
        <translation>Bediener</translation>
    </message>
    <message>
        <source>Present</source>
        <translation>Anwesend</translation>
    </message>
    <message>
        <source>Arrives</source>
        <translation>Kommt</translation>
    </message>
    <message>
        <source>Leaves</source>
        <translation>Geht</translation>
    </message>
    <message>
        <source>Minds</source>
        <translation>Bedient</translation>
    </message>
    <message>
        <source>Notes</source>
        <translation>Notizen</translation>
    </message>
    <message>
        <source>expired ({how})</source>
        <extracomment>Words read as &quot;authorised&quot; / &quot;not authorised&quot; when a block is pasted. An edit was refused (the message says why); nothing changed.</extracomment>
        <translation>abgelaufen ({how})</translation>
    </message>
    <message>
        <source>own authorisation</source>
        <translation>eigene Befugnis</translation>
    </message>
    <message>
        <source>through group {group}</source>
        <translation>über die Gruppe {group}</translation>
    </message>
    <message>
        <source>{operator} (id {id}): {notes}</source>
        <translation>{operator} (ID {id}): {notes}</translation>
    </message>
    <message>
        <source>{operator} (id {id})</source>
        <translation>{operator} (ID {id})</translation>
    </message>
    <message>
        <source>present</source>
        <translation>anwesend</translation>
    </message>
    <message>
        <source>absent</source>
        <translation>abwesend</translation>
    </message>
    <message>
        <source>Space or click: mark present or absent for this shift</source>
        <translation>Leertaste oder Klick: für diese Schicht als anwesend oder abwesend markieren</translation>
    </message>
    <message>
        <source>from the shift&apos;s start</source>
        <translation>ab Schichtbeginn</translation>
    </message>
    <message>
        <source>until the shift&apos;s end</source>
        <translation>bis Schichtende</translation>
    </message>
    <message>
        <source>When {operator} arrives: HH:MM within the shift, empty for the shift&apos;s start (F2 or double-click to type)</source>
        <translation>Wann {operator} kommt: HH:MM innerhalb der Schicht, leer für den Schichtbeginn (F2 oder Doppelklick zum Eingeben)</translation>
    </message>
    <message>
        <source>When {operator} leaves: HH:MM within the shift, empty for the shift&apos;s end (F2 or double-click to type)</source>
        <translation>Wann {operator} geht: HH:MM innerhalb der Schicht, leer für das Schichtende (F2 oder Doppelklick zum Eingeben)</translation>
    </message>
    <message>
        <source>Notes on {operator} (F2 or double-click to edit)</source>
        <translation>Notizen zu {operator} (F2 oder Doppelklick zum Bearbeiten)</translation>
    </message>
    <message>
        <source>How many machines {operator} runs at once (1 to {most})</source>
        <translation>Wie viele Maschinen {operator} gleichzeitig bedient (1 bis {most})</translation>
    </message>
    <message>
        <source>expired</source>
        <translation>abgelaufen</translation>
    </message>
    <message>
        <source>{mark} {days} d</source>
        <translation>{mark} {days} T</translation>
    </message>
    <message>
        <source>group</source>
        <translation>Gruppe</translation>
    </message>
    <message>
        <source>{operator} is not authorised for {machine} (Space or click: authorise)</source>
        <translation>{operator} ist für {machine} nicht befugt (Leertaste oder Klick: befugen)</translation>
    </message>
    <message>
        <source>{operator} for {machine}: {how}</source>
        <translation>{operator} für {machine}: {how}</translation>
    </message>
    <message numerus="yes">
        <source>, expired %n day(s) ago (counts as none)</source>
        <translation>
            <numerusform>, vor %n Tag abgelaufen (zählt nicht)</numerusform>
            <numerusform>, vor %n Tagen abgelaufen (zählt nicht)</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>, expires in %n day(s)</source>
        <translation>
            <numerusform>, läuft in %n Tag ab</numerusform>
            <numerusform>, läuft in %n Tagen ab</numerusform>
        </translation>
    </message>
    <message>
        <source>; the group&apos;s authorisation is given or withdrawn from the cell&apos;s menu</source>
        <translation>; die Gruppenbefugnis wird im Kontextmenü der Zelle erteilt oder entzogen</translation>
    </message>
    <message>
        <source>{machine}: runs unattended (needs no operator)</source>
        <translation>{machine}: läuft unbeaufsichtigt (braucht keinen Bediener)</translation>
    </message>
    <message>
        <source>Machine groups: {groups}</source>
        <translation>Maschinengruppen: {groups}</translation>
    </message>
    <message>
        <source>Right-click: runs unattended or needs an operator; machine groups</source>
        <translation>Rechtsklick: läuft unbeaufsichtigt oder braucht einen Bediener; Maschinengruppen</translation>
    </message>
    <message>
        <source>(unattended)</source>
        <translation>(unbeaufsichtigt)</translation>
    </message>
    <message>
        <source>renaming {operator} refused: {problem}; nothing changed</source>
        <translation>Umbenennen von {operator} abgelehnt: {problem}; nichts geändert</translation>
    </message>
    <message>
        <source>Rename {operator}</source>
        <translation>{operator} umbenennen</translation>
    </message>
    <message>
        <source>time refused: {problem}; nothing changed</source>
        <translation>Uhrzeit abgelehnt: {problem}; nichts geändert</translation>
    </message>
    <message>
        <source>{operator} arrives at {time}</source>
        <translation>{operator} kommt um {time}</translation>
    </message>
    <message>
        <source>{operator} arrives at the shift&apos;s start</source>
        <translation>{operator} kommt zum Schichtbeginn</translation>
    </message>
    <message>
        <source>{operator} leaves at {time}</source>
        <translation>{operator} geht um {time}</translation>
    </message>
    <message>
        <source>{operator} leaves at the shift&apos;s end</source>
        <translation>{operator} geht zum Schichtende</translation>
    </message>
    <message numerus="yes">
        <source>{operator} minds %n machine(s)</source>
        <translation>
            <numerusform>{operator} bedient %n Maschine</numerusform>
            <numerusform>{operator} bedient %n Maschinen</numerusform>
        </translation>
    </message>
    <message>
        <source>{operator} present</source>
        <translation>{operator} anwesend</translation>
    </message>
    <message>
        <source>{operator} absent</source>
        <translation>{operator} abwesend</translation>
    </message>
    <message>
        <source>Authorise {operator} for {machine}</source>
        <translation>{operator} für {machine} befugen</translation>
    </message>
    <message>
        <source>Withdraw {operator} for {machine}</source>
        <translation>Befugnis von {operator} für {machine} entziehen</translation>
    </message>
    <message>
        <source>paste authorisations into the machine columns</source>
        <translation>Befugnisse in die Maschinenspalten einfügen</translation>
    </message>
    <message>
        <source>the pasted block (row {row}, column {column}) reaches past the last operator or machine</source>
        <translation>der eingefügte Block (Zeile {row}, Spalte {column}) reicht über den letzten Bediener oder die letzte Maschine hinaus</translation>
    </message>
    <message>
        <source>pasted row {row}, column {column}: {cell} is neither yes (1, x, yes) nor no (0, empty, no)</source>
        <translation>eingefügte Zeile {row}, Spalte {column}: {cell} ist weder ja (1, x, ja) noch nein (0, leer, nein)</translation>
    </message>
</context>
<context>
    <name>CrewTab</name>
    <message>
        <source>Operators run only machines they are trained and authorised for; the site&apos;s training records decide, this table only repeats them.</source>
        <translation>Bediener führen nur Maschinen, für die sie geschult und befugt sind; es gelten die Schulungsnachweise des Standorts, diese Tabelle gibt sie nur wieder.</translation>
    </message>
    <message>
        <source>Crew</source>
        <translation>Personal</translation>
    </message>
    <message>
        <source>Operators of this shift, who is present, and what each is authorised to run</source>
        <translation>Die Bediener dieser Schicht, wer anwesend ist und was jeder führen darf</translation>
    </message>
    <message>
        <source>Crew table</source>
        <translation>Personaltabelle</translation>
    </message>
    <message>
        <source>One row per operator: present, arrives, leaves, machines minded at once, notes, and a check for each machine they may run; F2 on a machine cell sets the expiry date, the context menu gives machine groups and removes an operator</source>
        <translation>Eine Zeile je Bediener: anwesend, kommt, geht, gleichzeitig bediente Maschinen, Notizen und ein Haken für jede Maschine, die er führen darf; F2 auf einer Maschinenzelle setzt das Ablaufdatum, das Kontextmenü erteilt Maschinengruppen und entfernt einen Bediener</translation>
    </message>
    <message>
        <source>This shop has no crew: plans do not staff machines. Add an operator to plan with who is here.</source>
        <translation>Dieser Betrieb hat kein Personal: Pläne besetzen keine Maschinen. Einen Bediener hinzufügen, um mit den Anwesenden zu planen.</translation>
    </message>
    <message>
        <source>No crew</source>
        <translation>Kein Personal</translation>
    </message>
    <message>
        <source>Add &amp;operator</source>
        <translation>Bediener &amp;hinzufügen</translation>
    </message>
    <message>
        <source>Add operator</source>
        <translation>Bediener hinzufügen</translation>
    </message>
    <message>
        <source>Add an operator to the crew (Ctrl+Z takes it back)</source>
        <translation>Einen Bediener zum Personal hinzufügen (Strg+Z nimmt es zurück)</translation>
    </message>
    <message>
        <source>Remove opera&amp;tor</source>
        <translation>Bediener en&amp;tfernen</translation>
    </message>
    <message>
        <source>Remove operator</source>
        <translation>Bediener entfernen</translation>
    </message>
    <message>
        <source>Remove the operator of the current row with their authorisations (Ctrl+Z puts them back)</source>
        <translation>Den Bediener der aktuellen Zeile mit seinen Befugnissen entfernen (Strg+Z holt ihn zurück)</translation>
    </message>
    <message>
        <source>Machine gro&amp;ups…</source>
        <translation>Maschinen&amp;gruppen…</translation>
    </message>
    <message>
        <source>Machine groups</source>
        <translation>Maschinengruppen</translation>
    </message>
    <message>
        <source>See, create, rename and delete machine groups and choose their machines</source>
        <translation>Maschinengruppen ansehen, anlegen, umbenennen und löschen und ihre Maschinen wählen</translation>
    </message>
    <message>
        <source>Warn about authorisations expiring within</source>
        <translation>Warnen vor Befugnissen, die ablaufen innerhalb von</translation>
    </message>
    <message>
        <source> days</source>
        <translation> Tagen</translation>
    </message>
    <message>
        <source>Warning days</source>
        <translation>Warntage</translation>
    </message>
    <message>
        <source>Authorisations that run out within this many days of the shift&apos;s day are marked here and listed in the plan and on the sheet</source>
        <translation>Befugnisse, die innerhalb so vieler Tage nach dem Schichttag ablaufen, werden hier markiert und im Plan und auf dem Blatt aufgeführt</translation>
    </message>
    <message>
        <source>Safety caution</source>
        <translation>Sicherheitshinweis</translation>
    </message>
    <message>
        <source>{what} refused: {problem}; nothing changed</source>
        <translation>{what} abgelehnt: {problem}; nichts geändert</translation>
    </message>
    <message>
        <source>Operator {operator}</source>
        <translation>Bediener {operator}</translation>
    </message>
    <message>
        <source>&amp;Expiry date…</source>
        <translation>&amp;Ablaufdatum…</translation>
    </message>
    <message>
        <source>&amp;Notes…</source>
        <translation>&amp;Notizen…</translation>
    </message>
    <message>
        <source>Authorised for &amp;group</source>
        <translation>&amp;Befugt für Gruppe</translation>
    </message>
    <message>
        <source>Authorised for group</source>
        <translation>Befugt für Gruppe</translation>
    </message>
    <message>
        <source>(no machine groups)</source>
        <translation>(keine Maschinengruppen)</translation>
    </message>
    <message>
        <source>Runs una&amp;ttended (needs no operator)</source>
        <translation>Läuft &amp;unbeaufsichtigt (braucht keinen Bediener)</translation>
    </message>
    <message>
        <source>Add Operator {n}</source>
        <translation>Bediener {n} hinzufügen</translation>
    </message>
    <message>
        <source>Remove {operator}</source>
        <translation>{operator} entfernen</translation>
    </message>
    <message>
        <source>removing the operator</source>
        <translation>Entfernen des Bedieners</translation>
    </message>
    <message>
        <source>Notes</source>
        <translation>Notizen</translation>
    </message>
    <message>
        <source>Notes on {operator}:</source>
        <translation>Notizen zu {operator}:</translation>
    </message>
    <message>
        <source>Free text kept with the operator (shown in the crew table&apos;s tooltip)</source>
        <translation>Freier Text beim Bediener (im Tooltip der Personaltabelle gezeigt)</translation>
    </message>
    <message>
        <source>Notes on {operator}</source>
        <translation>Notizen zu {operator}</translation>
    </message>
    <message>
        <source>notes</source>
        <translation>Notizen</translation>
    </message>
    <message>
        <source>group {group} (all its machines)</source>
        <translation>Gruppe {group} (alle ihre Maschinen)</translation>
    </message>
    <message>
        <source>{operator} is not authorised for {machine}: authorise first (Space), then set the expiry date</source>
        <translation>{operator} ist für {machine} nicht befugt: zuerst befugen (Leertaste), dann das Ablaufdatum setzen</translation>
    </message>
    <message>
        <source>Authorisation expiry</source>
        <translation>Ablauf der Befugnis</translation>
    </message>
    <message>
        <source>{operator} for {what} expires on (YYYY-MM-DD; empty: never):</source>
        <translation>{operator} für {what} läuft ab am (JJJJ-MM-TT; leer: nie):</translation>
    </message>
    <message>
        <source>The last day the authorisation counts; after it the operator is not planned on these machines</source>
        <translation>Der letzte Tag, an dem die Befugnis gilt; danach wird der Bediener nicht mehr für diese Maschinen eingeplant</translation>
    </message>
    <message>
        <source>{operator} for {what}: expires {date}</source>
        <translation>{operator} für {what}: läuft am {date} ab</translation>
    </message>
    <message>
        <source>{operator} for {what}: no expiry</source>
        <translation>{operator} für {what}: ohne Ablauf</translation>
    </message>
    <message>
        <source>expiry date</source>
        <translation>Ablaufdatum</translation>
    </message>
    <message>
        <source>{machine} runs unattended</source>
        <translation>{machine} läuft unbeaufsichtigt</translation>
    </message>
    <message>
        <source>{machine} needs an operator</source>
        <translation>{machine} braucht einen Bediener</translation>
    </message>
    <message>
        <source>unattended machine</source>
        <translation>Unbeaufsichtigte Maschine</translation>
    </message>
    <message>
        <source>Authorise {operator} for group {group}</source>
        <translation>{operator} für die Gruppe {group} befugen</translation>
    </message>
    <message>
        <source>Withdraw {operator} from group {group}</source>
        <translation>Befugnis von {operator} für die Gruppe {group} entziehen</translation>
    </message>
    <message>
        <source>group authorisation</source>
        <translation>Gruppenbefugnis</translation>
    </message>
    <message numerus="yes">
        <source>Warn %n day(s) before an authorisation expires</source>
        <translation>
            <numerusform>%n Tag vor Ablauf einer Befugnis warnen</numerusform>
            <numerusform>%n Tage vor Ablauf einer Befugnis warnen</numerusform>
        </translation>
    </message>
    <message>
        <source>warning days</source>
        <translation>Warntage</translation>
    </message>
    <message>
        <source>Change machine groups</source>
        <translation>Maschinengruppen ändern</translation>
    </message>
    <message numerus="yes">
        <source>Withdraw %n authorisation(s)</source>
        <translation>
            <numerusform>%n Befugnis entziehen</numerusform>
            <numerusform>%n Befugnisse entziehen</numerusform>
        </translation>
    </message>
    <message>
        <source>paste into the crew refused: {problem}; nothing changed</source>
        <translation>Einfügen ins Personal abgelehnt: {problem}; nichts geändert</translation>
    </message>
    <message numerus="yes">
        <source>Paste %n authorisation(s)</source>
        <translation>
            <numerusform>%n Befugnis einfügen</numerusform>
            <numerusform>%n Befugnisse einfügen</numerusform>
        </translation>
    </message>
</context>
<context>
    <name>DecisionDialog</name>
    <message>
        <source>⚠ Safety first: before anyone works on this machine, apply lockout/tagout and follow the site&apos;s isolation procedure. Operators run only machines they are trained and authorised for. Follow each machine&apos;s setup instructions. Local regulations and the site&apos;s safety rules take precedence over this plan.</source>
        <translation>⚠ Sicherheit zuerst: bevor jemand an dieser Maschine arbeitet, Sperren und Kennzeichnen (LOTO) anwenden und das Freischaltverfahren des Standorts befolgen. Bediener führen nur Maschinen, für die sie geschult und befugt sind. Die Rüstanweisungen jeder Maschine befolgen. Örtliche Vorschriften und die Sicherheitsregeln des Standorts haben Vorrang vor diesem Plan.</translation>
    </message>
    <message>
        <source>What happened (for example: hydraulic leak, waiting for fitter)</source>
        <translation>Was passiert ist (zum Beispiel: Hydraulikleck, warten auf Schlosser)</translation>
    </message>
    <message>
        <source>What was done (for example: seal replaced, checked by maintenance)</source>
        <translation>Was getan wurde (zum Beispiel: Dichtung getauscht, von der Instandhaltung geprüft)</translation>
    </message>
    <message>
        <source>Why it is urgent (for example: customer line stopped)</source>
        <translation>Warum es eilt (zum Beispiel: Linie beim Kunden steht)</translation>
    </message>
    <message>
        <source>Why the job is pulled (for example: order cancelled, material not arrived)</source>
        <translation>Warum der Auftrag zurückgezogen wird (zum Beispiel: Bestellung storniert, Material nicht eingetroffen)</translation>
    </message>
    <message>
        <source>Anything the next shift should know</source>
        <translation>Was die nächste Schicht wissen sollte</translation>
    </message>
    <message>
        <source>Confirm re-dispatch - {title}</source>
        <translation>Neuzuteilung bestätigen - {title}</translation>
    </message>
    <message>
        <source>Event</source>
        <translation>Ereignis</translation>
    </message>
    <message>
        <source>What happened, as the decision will record it</source>
        <translation>Was passiert ist, wie die Entscheidung es erfasst</translation>
    </message>
    <message>
        <source>Safety reminder</source>
        <translation>Sicherheitshinweis</translation>
    </message>
    <message>
        <source>Lockout/tagout and the site&apos;s rules come before the plan</source>
        <translation>Sperren und Kennzeichnen (LOTO) und die Regeln des Standorts gehen dem Plan vor</translation>
    </message>
    <message>
        <source>{mark} No plan is possible after this event: {problem}</source>
        <translation>{mark} Nach diesem Ereignis ist kein Plan möglich: {problem}</translation>
    </message>
    <message>
        <source>{mark} &lt;b&gt;Not every rush job can be placed:&lt;/b&gt; {problem}</source>
        <translation>{mark} &lt;b&gt;Nicht jeder Eilauftrag kann eingeplant werden:&lt;/b&gt; {problem}</translation>
    </message>
    <message>
        <source>Re-dispatched from the plan in force; move penalties included: {value} {unit} (jobs dispatched but not started move only when the saving is larger).</source>
        <translation>Vom gültigen Plan aus neu zugeteilt; Umplanungskosten enthalten: {value} {unit} (zugeteilte, noch nicht begonnene Aufträge wechseln nur, wenn die Ersparnis größer ist).</translation>
    </message>
    <message>
        <source>The job is taken out of the shop document (Undo brings it back); earlier decisions in the history keep it.</source>
        <translation>Der Auftrag wird aus dem Betriebsdokument genommen (Rückgängig holt ihn zurück); frühere Entscheidungen im Verlauf behalten ihn.</translation>
    </message>
    <message>
        <source>&lt;b&gt;Proposed changes against {plan}:&lt;/b&gt;</source>
        <translation>&lt;b&gt;Vorgeschlagene Änderungen gegenüber {plan}:&lt;/b&gt;</translation>
    </message>
    <message>
        <source>Proposed changes</source>
        <translation>Vorgeschlagene Änderungen</translation>
    </message>
    <message>
        <source>How the proposed plan differs from the plan in force</source>
        <translation>Wie sich der vorgeschlagene Plan vom gültigen Plan unterscheidet</translation>
    </message>
    <message>
        <source>Reason</source>
        <translation>Grund</translation>
    </message>
    <message>
        <source>The kind of reason recorded with the decision</source>
        <translation>Die Art des Grundes, die mit der Entscheidung erfasst wird</translation>
    </message>
    <message>
        <source>&amp;Reason:</source>
        <translation>&amp;Grund:</translation>
    </message>
    <message>
        <source>Note</source>
        <translation>Notiz</translation>
    </message>
    <message>
        <source>&amp;Note:</source>
        <translation>&amp;Notiz:</translation>
    </message>
    <message>
        <source>Supervisor name (required)</source>
        <translation>Name der Schichtleitung (Pflicht)</translation>
    </message>
    <message>
        <source>Supervisor</source>
        <translation>Schichtleitung</translation>
    </message>
    <message>
        <source>Who takes the decision (required)</source>
        <translation>Wer die Entscheidung trifft (Pflicht)</translation>
    </message>
    <message>
        <source>&amp;Supervisor:</source>
        <translation>&amp;Schichtleitung:</translation>
    </message>
    <message>
        <source>Not recorded yet</source>
        <translation>Noch nicht gespeichert</translation>
    </message>
    <message>
        <source>Why the last confirmation was not recorded; confirming again retries</source>
        <translation>Warum die letzte Bestätigung nicht gespeichert wurde; erneutes Bestätigen versucht es noch einmal</translation>
    </message>
    <message>
        <source>Confirm and record</source>
        <translation>Bestätigen und erfassen</translation>
    </message>
    <message>
        <source>Record the decision in the history and put the plan in force</source>
        <translation>Die Entscheidung im Verlauf erfassen und den Plan in Kraft setzen</translation>
    </message>
    <message>
        <source>Cancel</source>
        <translation>Abbrechen</translation>
    </message>
    <message>
        <source>Close without recording; the plan in force stays</source>
        <translation>Schließen, ohne zu erfassen; der gültige Plan bleibt</translation>
    </message>
</context>
<context>
    <name>DecisionDiff</name>
    <message>
        <source>{machine} is down</source>
        <translation>{machine} ist ausgefallen</translation>
    </message>
    <message>
        <source>{machine} is back up</source>
        <translation>{machine} ist wieder bereit</translation>
    </message>
    <message>
        <source>Rush job: {job}</source>
        <translation>Eilauftrag: {job}</translation>
    </message>
    <message>
        <source>Job pulled: {job}</source>
        <translation>Auftrag zurückgezogen: {job}</translation>
    </message>
    <message>
        <source>Put the plan shown in force</source>
        <translation>Den angezeigten Plan in Kraft setzen</translation>
    </message>
    <message>
        <source>values</source>
        <translation>Werte</translation>
    </message>
    <message>
        <source>costs</source>
        <translation>Kosten</translation>
    </message>
    <message>
        <source>setups</source>
        <translation>Rüstzeiten</translation>
    </message>
    <message>
        <source>{planned_word} {before} → {after}, wait penalties {penalties_before} → {penalties_after}</source>
        <translation>{planned_word} {before} → {after}, Wartekosten {penalties_before} → {penalties_after}</translation>
    </message>
    <message>
        <source>; move penalties {value} (apart)</source>
        <translation>; Umplanungskosten {value} (gesondert)</translation>
    </message>
    <message>
        <source>No plan in force to compare with.</source>
        <translation>Kein gültiger Plan zum Vergleichen.</translation>
    </message>
    <message>
        <source>&lt;b&gt;pulled&lt;/b&gt;: {job} leaves the shop (frees {machine})</source>
        <translation>&lt;b&gt;zurückgezogen&lt;/b&gt;: {job} verlässt den Betrieb (macht {machine} frei)</translation>
    </message>
    <message>
        <source>&lt;b&gt;pulled&lt;/b&gt;: {job} leaves the shop</source>
        <translation>&lt;b&gt;zurückgezogen&lt;/b&gt;: {job} verlässt den Betrieb</translation>
    </message>
    <message>
        <source>&lt;b&gt;moves&lt;/b&gt;: {job} from {machine} to {to_machine}</source>
        <translation>&lt;b&gt;wechselt&lt;/b&gt;: {job} von {machine} auf {to_machine}</translation>
    </message>
    <message>
        <source>&lt;b&gt;starts&lt;/b&gt;: {job} on {machine}</source>
        <translation>&lt;b&gt;beginnt&lt;/b&gt;: {job} auf {machine}</translation>
    </message>
    <message>
        <source>&lt;b&gt;now waits&lt;/b&gt;: {job} (was on {machine})</source>
        <translation>&lt;b&gt;wartet jetzt&lt;/b&gt;: {job} (war auf {machine})</translation>
    </message>
    <message>
        <source>&lt;b&gt;now waits&lt;/b&gt;: {job}</source>
        <translation>&lt;b&gt;wartet jetzt&lt;/b&gt;: {job}</translation>
    </message>
    <message>
        <source>&lt;b&gt;now idle&lt;/b&gt;: {machine}</source>
        <translation>&lt;b&gt;jetzt frei&lt;/b&gt;: {machine}</translation>
    </message>
    <message>
        <source>&lt;b&gt;out of the plan&lt;/b&gt;: {machine}</source>
        <translation>&lt;b&gt;nicht mehr im Plan&lt;/b&gt;: {machine}</translation>
    </message>
    <message>
        <source>No job changes machine.</source>
        <translation>Kein Auftrag wechselt die Maschine.</translation>
    </message>
    <message>
        <source>Total: {before} → &lt;b&gt;{after}&lt;/b&gt; {unit} ({change})</source>
        <translation>Summe: {before} → &lt;b&gt;{after}&lt;/b&gt; {unit} ({change})</translation>
    </message>
    <message>
        <source> - lower only because fewer jobs are dispatched: a waiting job adds just its wait penalty</source>
        <translation> - nur niedriger, weil weniger Aufträge zugeteilt werden: ein wartender Auftrag kostet nur seine Wartekosten</translation>
    </message>
</context>
<context>
    <name>DecisionFlow</name>
    <message>
        <source>the plan in force (decision #{number})</source>
        <translation>dem gültigen Plan (Entscheidung Nr. {number})</translation>
    </message>
    <message>
        <source>the plan shown (no decision recorded yet)</source>
        <translation>dem angezeigten Plan (noch keine Entscheidung erfasst)</translation>
    </message>
    <message>
        <source>choose a cell in a machine column first (or use the column&apos;s menu)</source>
        <translation>zuerst eine Zelle in einer Maschinenspalte wählen (oder das Menü der Spalte benutzen)</translation>
    </message>
    <message>
        <source>{machine} is already down</source>
        <translation>{machine} ist bereits ausgefallen</translation>
    </message>
    <message>
        <source>{machine} is already up</source>
        <translation>{machine} ist bereits bereit</translation>
    </message>
    <message>
        <source>{job} is already a rush job</source>
        <translation>{job} ist bereits ein Eilauftrag</translation>
    </message>
    <message>
        <source>{job} is running: only a waiting job can become a rush job</source>
        <translation>{job} läuft: nur ein wartender Auftrag kann Eilauftrag werden</translation>
    </message>
    <message>
        <source>{job} is done: only a waiting job can become a rush job</source>
        <translation>{job} ist erledigt: nur ein wartender Auftrag kann Eilauftrag werden</translation>
    </message>
    <message>
        <source>choose a cell in the job&apos;s row first (or use the row&apos;s menu)</source>
        <translation>zuerst eine Zelle in der Zeile des Auftrags wählen (oder das Menü der Zeile benutzen)</translation>
    </message>
    <message>
        <source>{job} is already done; there is nothing to pull</source>
        <translation>{job} ist bereits erledigt; es gibt nichts zurückzuziehen</translation>
    </message>
    <message>
        <source>Decision not recorded</source>
        <translation>Entscheidung nicht erfasst</translation>
    </message>
    <message>
        <source>{error}

The plan in force is unchanged.</source>
        <translation>{error}

Der gültige Plan bleibt unverändert.</translation>
    </message>
    <message>
        <source>Not recorded: the history could not be written. Nothing was changed; press Confirm and record to try again.</source>
        <translation>Nicht gespeichert: Die Historie konnte nicht geschrieben werden. Nichts wurde geändert; bestätigen Sie erneut, um es noch einmal zu versuchen.</translation>
    </message>
    <message>
        <source>The plan in force and the open document are unchanged; the decision dialog stays open so that you can confirm again.</source>
        <translation>Der gültige Plan und das geöffnete Dokument sind unverändert; der Entscheidungsdialog bleibt offen, damit Sie erneut bestätigen können.</translation>
    </message>
    <message>
        <source>{title} (decision #{number})</source>
        <translation>{title} (Entscheidung Nr. {number})</translation>
    </message>
    <message>
        <source>plan in force</source>
        <translation>gültiger Plan</translation>
    </message>
    <message>
        <source>decision #{number} ({title})</source>
        <translation>Entscheidung Nr. {number} ({title})</translation>
    </message>
    <message>
        <source>Decision #{number} recorded: {title}</source>
        <translation>Entscheidung Nr. {number} erfasst: {title}</translation>
    </message>
</context>
<context>
    <name>DecisionListModel</name>
    <message>
        <source>Time (local)</source>
        <extracomment>Column heads (English; the model shows them translated).</extracomment>
        <translation>Zeit (Ortszeit)</translation>
    </message>
    <message>
        <source>Shift</source>
        <translation>Schicht</translation>
    </message>
    <message>
        <source>Supervisor</source>
        <translation>Schichtleitung</translation>
    </message>
    <message>
        <source>Reason</source>
        <translation>Grund</translation>
    </message>
    <message>
        <source>Note</source>
        <translation>Notiz</translation>
    </message>
    <message>
        <source>Total</source>
        <translation>Summe</translation>
    </message>
    <message>
        <source>Proof</source>
        <translation>Nachweis</translation>
    </message>
    <message>
        <source>✓ checked</source>
        <translation>✓ geprüft</translation>
    </message>
    <message>
        <source>Total of decision #{number} ({objective}); replaces #{replaces}</source>
        <translation>Summe der Entscheidung Nr. {number} ({objective}); ersetzt Nr. {replaces}</translation>
    </message>
    <message>
        <source>Decision #{number}, restored from #{restored}</source>
        <translation>Entscheidung Nr. {number}, wiederhergestellt aus Nr. {restored}</translation>
    </message>
    <message>
        <source>Decision #{number}</source>
        <translation>Entscheidung Nr. {number}</translation>
    </message>
    <message>
        <source>Recorded at {time} UTC</source>
        <translation>Erfasst am {time} UTC</translation>
    </message>
</context>
<context>
    <name>FileController</name>
    <message>
        <source>Opening {path}… (Esc cancels)</source>
        <translation>{path} wird geöffnet… (Esc bricht ab)</translation>
    </message>
    <message>
        <source>the new shop</source>
        <translation>der neue Betrieb</translation>
    </message>
    <message>
        <source>{name} has changes that are not saved. Save them?</source>
        <translation>{name} hat Änderungen, die nicht gespeichert sind. Speichern?</translation>
    </message>
    <message>
        <source>New shop</source>
        <translation>Neuer Betrieb</translation>
    </message>
    <message>
        <source>Opening {path}…</source>
        <translation>{path} wird geöffnet…</translation>
    </message>
    <message>
        <source>{path}: cannot be read ({error})</source>
        <translation>{path}: kann nicht gelesen werden ({error})</translation>
    </message>
    <message>
        <source>Cannot open file</source>
        <translation>Datei kann nicht geöffnet werden</translation>
    </message>
    <message>
        <source>Not opened: {problem}</source>
        <translation>Nicht geöffnet: {problem}</translation>
    </message>
    <message>
        <source>Not opened: reading {path} was cancelled</source>
        <translation>Nicht geöffnet: Lesen von {path} wurde abgebrochen</translation>
    </message>
    <message>
        <source>Opened {path}</source>
        <translation>{path} geöffnet</translation>
    </message>
    <message>
        <source>Cannot save</source>
        <translation>Speichern nicht möglich</translation>
    </message>
    <message>
        <source>Not saved: {problem}</source>
        <translation>Nicht gespeichert: {problem}</translation>
    </message>
    <message>
        <source>Saved {path}</source>
        <translation>{path} gespeichert</translation>
    </message>
    <message>
        <source>Cannot export</source>
        <translation>Exportieren nicht möglich</translation>
    </message>
    <message>
        <source>Exported the grid to {path}</source>
        <translation>Raster nach {path} exportiert</translation>
    </message>
    <message>
        <source>Exported the plan to {path}</source>
        <translation>Plan nach {path} exportiert</translation>
    </message>
    <message>
        <source>Cannot import</source>
        <translation>Importieren nicht möglich</translation>
    </message>
    <message>
        <source>Import {file}</source>
        <translation>{file} importieren</translation>
    </message>
    <message>
        <source>Grid imported</source>
        <translation>Raster importiert</translation>
    </message>
    <message>
        <source>Imported {path}</source>
        <translation>{path} importiert</translation>
    </message>
    <message>
        <source>Recover unsaved work</source>
        <translation>Ungesicherte Arbeit wiederherstellen</translation>
    </message>
    <message>
        <source>The app did not close normally last time. Recover the unsaved copy saved at {time}?</source>
        <translation>Die Anwendung wurde beim letzten Mal nicht normal beendet. Die ungespeicherte Kopie vom {time} wiederherstellen?</translation>
    </message>
    <message>
        <source>Cannot recover</source>
        <translation>Wiederherstellen nicht möglich</translation>
    </message>
    <message>
        <source>Recovered unsaved work; save it under a name</source>
        <translation>Ungesicherte Arbeit wiederhergestellt; unter einem Namen speichern</translation>
    </message>
</context>
<context>
    <name>Format</name>
    <message>
        <source>shift start</source>
        <extracomment>Reason kinds (:data:`dispatcher.history.REASON_KINDS`) as shown; English, translated.</extracomment>
        <translation>Schichtbeginn</translation>
    </message>
    <message>
        <source>breakdown</source>
        <translation>Störung</translation>
    </message>
    <message>
        <source>repair</source>
        <translation>Reparatur</translation>
    </message>
    <message>
        <source>rush job</source>
        <translation>Eilauftrag</translation>
    </message>
    <message>
        <source>manual change</source>
        <translation>manuelle Änderung</translation>
    </message>
    <message>
        <source>restored</source>
        <translation>wiederhergestellt</translation>
    </message>
    <message>
        <source>other</source>
        <translation>sonstiges</translation>
    </message>
    <message>
        <source>setup min</source>
        <translation>Rüstmin.</translation>
    </message>
    <message>
        <source>cost</source>
        <translation>Kosten</translation>
    </message>
    <message>
        <source>value</source>
        <translation>Wert</translation>
    </message>
    <message>
        <source>{text} is not a number (type x or leave empty when the machine cannot run the job)</source>
        <translation>{text} ist keine Zahl (x eingeben oder leer lassen, wenn die Maschine den Auftrag nicht ausführen kann)</translation>
    </message>
    <message>
        <source>{text} is not a finite number</source>
        <translation>{text} ist keine endliche Zahl</translation>
    </message>
    <message>
        <source>{value} is negative; values must be &gt;= 0</source>
        <translation>{value} ist negativ; Werte müssen &gt;= 0 sein</translation>
    </message>
</context>
<context>
    <name>GridEdits</name>
    <message>
        <source>nothing typed over a changeover table in the selection</source>
        <translation>In der Auswahl ist nichts über eine Rüsttabelle getippt</translation>
    </message>
    <message numerus="yes">
        <source>Use changeover table in %n cell(s)</source>
        <translation>
            <numerusform>Rüsttabelle in %n Zelle verwenden</numerusform>
            <numerusform>Rüsttabelle in %n Zellen verwenden</numerusform>
        </translation>
    </message>
    <message>
        <source>choose a cell in a machine column first</source>
        <translation>zuerst eine Zelle in einer Maschinenspalte wählen</translation>
    </message>
    <message>
        <source>Copied {rows} x {columns} cells</source>
        <translation>{rows} x {columns} Zellen kopiert</translation>
    </message>
    <message>
        <source>nothing to paste into: the shop has no jobs or machines</source>
        <translation>nichts zum Einfügen: der Betrieb hat keine Aufträge oder Maschinen</translation>
    </message>
    <message numerus="yes">
        <source>Paste %n cell(s)</source>
        <translation>
            <numerusform>%n Zelle einfügen</numerusform>
            <numerusform>%n Zellen einfügen</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>Pasted; %n cell(s) changed</source>
        <translation>
            <numerusform>Eingefügt; %n Zelle geändert</numerusform>
            <numerusform>Eingefügt; %n Zellen geändert</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>Mark %n cell(s) cannot run</source>
        <translation>
            <numerusform>%n Zelle als nicht möglich markieren</numerusform>
            <numerusform>%n Zellen als nicht möglich markieren</numerusform>
        </translation>
    </message>
    <message>
        <source>Pin {job} to {machine}</source>
        <translation>{job} auf {machine} festlegen</translation>
    </message>
    <message>
        <source>Forbid {job} on {machine}</source>
        <translation>{job} auf {machine} verbieten</translation>
    </message>
    <message>
        <source>Clear pin of {job} on {machine}</source>
        <translation>Festlegung von {job} auf {machine} aufheben</translation>
    </message>
    <message>
        <source>Add job</source>
        <translation>Auftrag hinzufügen</translation>
    </message>
    <message>
        <source>Name of the new job (unique):</source>
        <translation>Name des neuen Auftrags (eindeutig):</translation>
    </message>
    <message>
        <source>A new row: the job cannot run anywhere until values are typed in</source>
        <translation>Eine neue Zeile: der Auftrag kann nirgends laufen, bis Werte eingegeben sind</translation>
    </message>
    <message>
        <source>job name {name} is empty or already used</source>
        <translation>Auftragsname {name} ist leer oder schon vergeben</translation>
    </message>
    <message>
        <source>Add job {name}</source>
        <translation>Auftrag {name} hinzufügen</translation>
    </message>
    <message>
        <source>Added {name}: type its values; Ctrl+R if it is a rush job</source>
        <translation>{name} hinzugefügt: seine Werte eingeben; Strg+R, wenn es ein Eilauftrag ist</translation>
    </message>
    <message>
        <source>Add machine</source>
        <translation>Maschine hinzufügen</translation>
    </message>
    <message>
        <source>Name of the new machine (unique):</source>
        <translation>Name der neuen Maschine (eindeutig):</translation>
    </message>
    <message>
        <source>A new column: no job can run on it until values are typed in</source>
        <translation>Eine neue Spalte: kein Auftrag kann darauf laufen, bis Werte eingegeben sind</translation>
    </message>
    <message>
        <source>machine name {name} is empty or already used</source>
        <translation>Maschinenname {name} ist leer oder schon vergeben</translation>
    </message>
    <message>
        <source>Add machine {name}</source>
        <translation>Maschine {name} hinzufügen</translation>
    </message>
    <message>
        <source>{job} done</source>
        <translation>{job} erledigt</translation>
    </message>
    <message>
        <source>Wait penalty</source>
        <translation>Wartekosten</translation>
    </message>
    <message>
        <source>Cost of leaving {job} waiting:</source>
        <translation>Kosten, wenn {job} warten muss:</translation>
    </message>
    <message>
        <source>Added to the plan&apos;s total when the job waits</source>
        <translation>Wird zur Summe des Plans addiert, wenn der Auftrag wartet</translation>
    </message>
    <message>
        <source>Wait penalty of {job}</source>
        <translation>Wartekosten von {job}</translation>
    </message>
    <message>
        <source>Slots</source>
        <translation>Plätze</translation>
    </message>
    <message>
        <source>Jobs {machine} takes per round:</source>
        <translation>Aufträge, die {machine} je Runde übernimmt:</translation>
    </message>
    <message>
        <source>How many jobs the machine runs at once, 1 to 100</source>
        <translation>Wie viele Aufträge die Maschine gleichzeitig fährt, 1 bis 100</translation>
    </message>
    <message numerus="yes">
        <source>{machine} takes %n job(s)</source>
        <translation>
            <numerusform>{machine} übernimmt %n Auftrag</numerusform>
            <numerusform>{machine} übernimmt %n Aufträge</numerusform>
        </translation>
    </message>
    <message>
        <source>{machine}: in maintenance</source>
        <translation>{machine}: in Wartung</translation>
    </message>
    <message>
        <source>{machine}: up</source>
        <translation>{machine}: bereit</translation>
    </message>
    <message>
        <source>(nothing mounted)</source>
        <translation>(nichts gerüstet)</translation>
    </message>
    <message>
        <source>(any family)</source>
        <translation>(beliebige Familie)</translation>
    </message>
    <message>
        <source>Mounted family</source>
        <translation>Gerüstete Familie</translation>
    </message>
    <message>
        <source>End family</source>
        <translation>Endfamilie</translation>
    </message>
    <message>
        <source>Family {machine} has mounted now:</source>
        <translation>Familie, die {machine} jetzt gerüstet hat:</translation>
    </message>
    <message>
        <source>Family {machine} must end the shift in:</source>
        <translation>Familie, in der {machine} die Schicht beenden muss:</translation>
    </message>
    <message>
        <source>A family of the machine&apos;s changeover table</source>
        <translation>Eine Familie aus der Rüstwechseltabelle der Maschine</translation>
    </message>
    <message>
        <source>{machine}: the family name {problem}</source>
        <translation>{machine}: der Familienname {problem}</translation>
    </message>
    <message>
        <source>{machine}: family {family} is not in changeover table {table}</source>
        <translation>{machine}: Familie {family} steht nicht in der Rüsttabelle {table}</translation>
    </message>
    <message>
        <source>{machine} has no changeover table; add it to one first</source>
        <translation>{machine} hat keine Rüsttabelle; zuerst einer Tabelle zuordnen</translation>
    </message>
    <message>
        <source>{machine} has {family} mounted</source>
        <translation>{machine} hat {family} gerüstet</translation>
    </message>
    <message>
        <source>{machine} ends the shift in {family}</source>
        <translation>{machine} beendet die Schicht in {family}</translation>
    </message>
</context>
<context>
    <name>GridModel</name>
    <message>
        <source>Rush</source>
        <extracomment>Heads of the leading columns (English; the model shows them translated).</extracomment>
        <translation>Eilt</translation>
    </message>
    <message>
        <source>Wait penalty</source>
        <translation>Wartekosten</translation>
    </message>
    <message>
        <source>Run hours</source>
        <translation>Laufzeit (h)</translation>
    </message>
    <message>
        <source>Family</source>
        <translation>Familie</translation>
    </message>
    <message>
        <source>Plan puts it on</source>
        <translation>Plan setzt ihn auf</translation>
    </message>
    <message>
        <source>up</source>
        <extracomment>The roles a heading answers (:meth:`GridModel.headerData`). The roles kept per cell (a role not listed, such as the tooltip, is computed when asked). At most this many cells are kept (a few pages of a big shop); the cache starts afresh. A machine&apos;s state in its column head, after its mark (English; shown translated).
----------
A machine&apos;s state in a sentence (English; shown translated).</extracomment>
        <translation>bereit</translation>
    </message>
    <message>
        <source>DOWN</source>
        <translation>AUSGEFALLEN</translation>
    </message>
    <message>
        <source>maintenance</source>
        <translation>Wartung</translation>
    </message>
    <message>
        <source>down</source>
        <translation>ausgefallen</translation>
    </message>
    <message>
        <source>in maintenance</source>
        <translation>in Wartung</translation>
    </message>
    <message>
        <source>{mark} RUSH</source>
        <translation>{mark} EILT</translation>
    </message>
    <message>
        <source>{job} is a rush job: the plan must place it this round</source>
        <translation>{job} ist ein Eilauftrag: der Plan muss ihn in dieser Runde einplanen</translation>
    </message>
    <message>
        <source>{job} may wait if the machines are needed elsewhere (tick to make it a rush job)</source>
        <translation>{job} darf warten, wenn die Maschinen anderswo gebraucht werden (ankreuzen für Eilauftrag)</translation>
    </message>
    <message>
        <source>Wait penalty of {job}: {value} ({unit}) added to the total if it is left waiting</source>
        <translation>Wartekosten von {job}: {value} ({unit}) kommen zur Summe hinzu, wenn er warten muss</translation>
    </message>
    <message>
        <source>Run hours of {job}: not given (needed only to fill the whole shift)</source>
        <translation>Laufzeit von {job}: nicht angegeben (nur zum Füllen der ganzen Schicht nötig)</translation>
    </message>
    <message>
        <source>Run hours of {job}: {hours} h (times each machine&apos;s speed factor; used when filling the whole shift)</source>
        <translation>Laufzeit von {job}: {hours} h (mal dem Geschwindigkeitsfaktor jeder Maschine; zum Füllen der ganzen Schicht)</translation>
    </message>
    <message>
        <source>{job} names no setup family: its values are typed in the grid (type a family to price it by the changeover tables)</source>
        <translation>{job} nennt keine Rüstfamilie: seine Werte werden im Raster getippt (eine Familie eintragen, um ihn nach den Rüsttabellen zu bewerten)</translation>
    </message>
    <message>
        <source>{job} needs family {family}, which no changeover table lists: it waits unless values are typed</source>
        <translation>{job} braucht die Familie {family}, die keine Rüsttabelle führt: er wartet, solange keine Werte getippt sind</translation>
    </message>
    <message>
        <source>{job} needs family {family} (changeover tables: {tables})</source>
        <translation>{job} braucht die Familie {family} (Rüsttabellen: {tables})</translation>
    </message>
    <message>
        <source>▶ runs on {machine}</source>
        <translation>▶ läuft auf {machine}</translation>
    </message>
    <message>
        <source>{job} is already running on {machine}; it stays there</source>
        <translation>{job} läuft bereits auf {machine}; er bleibt dort</translation>
    </message>
    <message>
        <source>The plan puts {job} on {machine} (value {value} {unit})</source>
        <translation>Der Plan setzt {job} auf {machine} (Wert {value} {unit})</translation>
    </message>
    <message>
        <source>done</source>
        <translation>erledigt</translation>
    </message>
    <message>
        <source>{job} is done and takes no part</source>
        <translation>{job} ist erledigt und wird nicht mehr eingeplant</translation>
    </message>
    <message>
        <source>○ waits</source>
        <translation>○ wartet</translation>
    </message>
    <message>
        <source>{job} waits this round: {reason}</source>
        <translation>{job} wartet in dieser Runde: {reason}</translation>
    </message>
    <message>
        <source>{job} waits this round</source>
        <translation>{job} wartet in dieser Runde</translation>
    </message>
    <message>
        <source>no plan yet</source>
        <translation>noch kein Plan</translation>
    </message>
    <message>
        <source>nothing mounted</source>
        <translation>nichts gerüstet</translation>
    </message>
    <message>
        <source>Derived from changeover table {table}: change from {mounted} to {family}</source>
        <translation>Aus der Rüsttabelle {table} abgeleitet: Wechsel von {mounted} zu {family}</translation>
    </message>
    <message>
        <source>the table gives {value}</source>
        <translation>die Tabelle ergibt {value}</translation>
    </message>
    <message>
        <source>the table does not allow this change</source>
        <translation>die Tabelle erlaubt diesen Wechsel nicht</translation>
    </message>
    <message>
        <source>{mark} typed over changeover table {table} ({table_says}); Use changeover table puts the table&apos;s value back</source>
        <translation>{mark} über die Rüsttabelle {table} getippt ({table_says}); Rüsttabelle verwenden stellt den Tabellenwert wieder her</translation>
    </message>
    <message>
        <source>{machine} cannot run {job} (type a number to allow it)</source>
        <translation>{machine} kann {job} nicht ausführen (eine Zahl eingeben, um es zu erlauben)</translation>
    </message>
    <message>
        <source>Value of {job} on {machine}: {value} ({unit})</source>
        <translation>Wert von {job} auf {machine}: {value} ({unit})</translation>
    </message>
    <message>
        <source>{mark} the plan shown puts {job} here</source>
        <translation>{mark} der angezeigte Plan setzt {job} hierher</translation>
    </message>
    <message>
        <source>{mark} {job} is already running here</source>
        <translation>{mark} {job} läuft hier bereits</translation>
    </message>
    <message>
        <source>{mark} pinned: {job} must go to {machine}</source>
        <translation>{mark} festgelegt: {job} muss auf {machine}</translation>
    </message>
    <message>
        <source>{mark} forbidden: {job} must not go to {machine}</source>
        <translation>{mark} verboten: {job} darf nicht auf {machine}</translation>
    </message>
    <message>
        <source>{machine} is {state} and takes no jobs</source>
        <translation>{machine} ist {state} und nimmt keine Aufträge an</translation>
    </message>
    <message>
        <source>Lockout/tagout before any work on {machine}</source>
        <translation>Vor jeder Arbeit an {machine} Sperren und Kennzeichnen (LOTO)</translation>
    </message>
    <message>
        <source>Rush jobs must be placed this round</source>
        <translation>Eilaufträge müssen in dieser Runde eingeplant werden</translation>
    </message>
    <message>
        <source>Hours each job runs (to fill the whole shift)</source>
        <translation>Stunden, die jeder Auftrag läuft (zum Füllen der ganzen Schicht)</translation>
    </message>
    <message>
        <source>Setup family each job needs (mould, die, colour group); prices its changeovers</source>
        <translation>Rüstfamilie, die jeder Auftrag braucht (Form, Werkzeug, Farbgruppe); bestimmt seine Rüstwechsel</translation>
    </message>
    <message>
        <source>Added to the total ({unit}) when the job waits</source>
        <translation>Kommt zur Summe ({unit}) hinzu, wenn der Auftrag wartet</translation>
    </message>
    <message>
        <source>Where the plan shown puts each job</source>
        <translation>Wohin der angezeigte Plan jeden Auftrag setzt</translation>
    </message>
    <message>
        <source>unattended</source>
        <translation>unbeaufsichtigt</translation>
    </message>
    <message numerus="yes">
        <source>{machine}: {state}, takes %n job(s) per round</source>
        <translation>
            <numerusform>{machine}: {state}, übernimmt %n Auftrag je Runde</numerusform>
            <numerusform>{machine}: {state}, übernimmt %n Aufträge je Runde</numerusform>
        </translation>
    </message>
    <message>
        <source>{mark} mounted now: {family}</source>
        <translation>{mark} jetzt gerüstet: {family}</translation>
    </message>
    <message>
        <source>nothing (cleaned)</source>
        <translation>nichts (gereinigt)</translation>
    </message>
    <message>
        <source>{mark} must end the shift in: {family}</source>
        <translation>{mark} muss die Schicht beenden in: {family}</translation>
    </message>
    <message>
        <source>Changeover table: {table}</source>
        <translation>Rüsttabelle: {table}</translation>
    </message>
    <message>
        <source>No changeover table: values are typed</source>
        <translation>Keine Rüsttabelle: Werte werden getippt</translation>
    </message>
    <message>
        <source>Operator in the plan shown: {operator}</source>
        <translation>Bediener im angezeigten Plan: {operator}</translation>
    </message>
    <message>
        <source>Note: {note}</source>
        <translation>Hinweis: {note}</translation>
    </message>
    <message>
        <source>Right-click (or Shift+F10) for machine actions</source>
        <translation>Rechtsklick (oder Umschalt+F10) für Maschinenaktionen</translation>
    </message>
    <message>
        <source>(done) {job}</source>
        <translation>(erledigt) {job}</translation>
    </message>
    <message>
        <source>work order {work_order}</source>
        <translation>Arbeitsauftrag {work_order}</translation>
    </message>
    <message>
        <source>due {time}</source>
        <translation>fällig {time}</translation>
    </message>
    <message>
        <source>state: {state}</source>
        <translation>Status: {state}</translation>
    </message>
    <message>
        <source>waiting</source>
        <translation>wartend</translation>
    </message>
    <message>
        <source>running</source>
        <translation>laufend</translation>
    </message>
    <message>
        <source>Mark {job} as rush</source>
        <translation>{job} als Eilauftrag markieren</translation>
    </message>
    <message>
        <source>Unmark {job} as rush</source>
        <translation>{job} nicht mehr als Eilauftrag</translation>
    </message>
    <message>
        <source>{job}: {problem}</source>
        <translation>{job}: {problem}</translation>
    </message>
    <message>
        <source>{job}: run hours must be a number &gt; 0 (or empty)</source>
        <translation>{job}: die Laufzeit muss eine Zahl &gt; 0 sein (oder leer)</translation>
    </message>
    <message>
        <source>Run hours of {job} = {hours}</source>
        <translation>Laufzeit von {job} = {hours}</translation>
    </message>
    <message>
        <source>none</source>
        <translation>keine</translation>
    </message>
    <message>
        <source>{job}: the wait penalty must be a number &gt;= 0</source>
        <translation>{job}: die Wartekosten müssen eine Zahl &gt;= 0 sein</translation>
    </message>
    <message>
        <source>Wait penalty of {job} = {value}</source>
        <translation>Wartekosten von {job} = {value}</translation>
    </message>
    <message>
        <source>cannot run</source>
        <translation>nicht möglich</translation>
    </message>
    <message>
        <source>{job} on {machine} = {value}</source>
        <translation>{job} auf {machine} = {value}</translation>
    </message>
    <message>
        <source>{job}: the family name {problem}</source>
        <translation>{job}: der Familienname {problem}</translation>
    </message>
    <message>
        <source>Family of {job} = {family}</source>
        <translation>Familie von {job} = {family}</translation>
    </message>
    <message>
        <source>Family of {job} cleared</source>
        <translation>Familie von {job} gelöscht</translation>
    </message>
</context>
<context>
    <name>GroupsDialog</name>
    <message>
        <source>Machine groups</source>
        <translation>Maschinengruppen</translation>
    </message>
    <message>
        <source>Groups of machines an operator can be authorised for at once</source>
        <translation>Gruppen von Maschinen, für die ein Bediener auf einmal befugt werden kann</translation>
    </message>
    <message>
        <source>Groups</source>
        <translation>Gruppen</translation>
    </message>
    <message>
        <source>The machine groups of this shop; choose one to see and change its machines</source>
        <translation>Die Maschinengruppen dieses Betriebs; eine wählen, um ihre Maschinen zu sehen und zu ändern</translation>
    </message>
    <message>
        <source>Machines of the group</source>
        <translation>Maschinen der Gruppe</translation>
    </message>
    <message>
        <source>A check for each machine in the chosen group (Space toggles)</source>
        <translation>Ein Haken für jede Maschine der gewählten Gruppe (Leertaste schaltet um)</translation>
    </message>
    <message>
        <source>Group name</source>
        <translation>Gruppenname</translation>
    </message>
    <message>
        <source>The name for a new group, or the new name of the chosen group</source>
        <translation>Der Name für eine neue Gruppe oder der neue Name der gewählten Gruppe</translation>
    </message>
    <message>
        <source>&amp;New group</source>
        <translation>&amp;Neue Gruppe</translation>
    </message>
    <message>
        <source>New group</source>
        <translation>Neue Gruppe</translation>
    </message>
    <message>
        <source>Add a group with the name typed, without machines</source>
        <translation>Eine Gruppe mit dem eingegebenen Namen anlegen, ohne Maschinen</translation>
    </message>
    <message>
        <source>&amp;Rename</source>
        <translation>&amp;Umbenennen</translation>
    </message>
    <message>
        <source>Rename group</source>
        <translation>Gruppe umbenennen</translation>
    </message>
    <message>
        <source>Give the chosen group the name typed; its authorisations keep it</source>
        <translation>Der gewählten Gruppe den eingegebenen Namen geben; ihre Befugnisse bleiben bei ihr</translation>
    </message>
    <message>
        <source>&amp;Delete</source>
        <translation>&amp;Löschen</translation>
    </message>
    <message>
        <source>Delete group</source>
        <translation>Gruppe löschen</translation>
    </message>
    <message>
        <source>Delete the chosen group and the authorisations through it</source>
        <translation>Die gewählte Gruppe und die Befugnisse über sie löschen</translation>
    </message>
    <message>
        <source>Problem</source>
        <translation>Problem</translation>
    </message>
    <message>
        <source>Use these groups (Ctrl+Z takes the change back)</source>
        <translation>Diese Gruppen verwenden (Strg+Z nimmt die Änderung zurück)</translation>
    </message>
    <message>
        <source>Close without changing anything</source>
        <translation>Schließen, ohne etwas zu ändern</translation>
    </message>
    <message>
        <source>Groups:</source>
        <translation>Gruppen:</translation>
    </message>
    <message>
        <source>Machines in the group:</source>
        <translation>Maschinen der Gruppe:</translation>
    </message>
    <message>
        <source>refused: {problem}; nothing changed</source>
        <translation>abgelehnt: {problem}; nichts geändert</translation>
    </message>
    <message>
        <source>a group named {name} exists already; nothing changed</source>
        <translation>eine Gruppe namens {name} gibt es schon; nichts geändert</translation>
    </message>
    <message numerus="yes">
        <source>%n authorisation(s) through the deleted group go with it</source>
        <translation>
            <numerusform>%n Befugnis über die gelöschte Gruppe entfällt mit ihr</numerusform>
            <numerusform>%n Befugnisse über die gelöschte Gruppe entfallen mit ihr</numerusform>
        </translation>
    </message>
</context>
<context>
    <name>HistoryDock</name>
    <message>
        <source>History</source>
        <extracomment>While the dock is shown, how often it looks for decisions recorded by other stations. How long the listening thread waits for a notification before looking whether it should stop, and how long it waits after a fault before connecting again (seconds).</extracomment>
        <translation>Verlauf</translation>
    </message>
    <message>
        <source>The decisions recorded for this shop: filter, compare, restore</source>
        <translation>Die für diesen Betrieb erfassten Entscheidungen: filtern, vergleichen, wiederherstellen</translation>
    </message>
    <message>
        <source>Show or hide the recorded decisions</source>
        <translation>Die erfassten Entscheidungen zeigen oder ausblenden</translation>
    </message>
    <message>
        <source>Restore decision</source>
        <translation>Entscheidung wiederherstellen</translation>
    </message>
    <message>
        <source>Restore decision #{number}: supervisor name</source>
        <translation>Entscheidung Nr. {number} wiederherstellen: Name der Schichtleitung</translation>
    </message>
    <message>
        <source>Who records the restored plan as a new decision</source>
        <translation>Wer den wiederhergestellten Plan als neue Entscheidung erfasst</translation>
    </message>
    <message>
        <source>Cannot restore</source>
        <translation>Wiederherstellen nicht möglich</translation>
    </message>
    <message>
        <source>Decision #{number} restored as #{new}</source>
        <translation>Entscheidung Nr. {number} als Nr. {new} wiederhergestellt</translation>
    </message>
</context>
<context>
    <name>HistoryPanel</name>
    <message>
        <source>Job</source>
        <translation>Auftrag</translation>
    </message>
    <message>
        <source>Machine</source>
        <translation>Maschine</translation>
    </message>
    <message>
        <source>Supervisor</source>
        <translation>Schichtleitung</translation>
    </message>
    <message>
        <source>Filter by</source>
        <translation>Filtern nach</translation>
    </message>
    <message>
        <source>Which name the filter text looks for</source>
        <translation>Nach welchem Namen der Filtertext sucht</translation>
    </message>
    <message>
        <source>name to look for (exact), empty = all</source>
        <translation>gesuchter Name (genau), leer = alle</translation>
    </message>
    <message>
        <source>Filter text</source>
        <translation>Filtertext</translation>
    </message>
    <message>
        <source>any reason</source>
        <translation>jeder Grund</translation>
    </message>
    <message>
        <source>Reason filter</source>
        <translation>Filter nach Grund</translation>
    </message>
    <message>
        <source>Show only decisions with this kind of reason</source>
        <translation>Nur Entscheidungen mit dieser Art von Grund zeigen</translation>
    </message>
    <message>
        <source>Refresh</source>
        <translation>A&amp;ktualisieren</translation>
    </message>
    <message>
        <source>Read the decisions again with these filters</source>
        <translation>Die Entscheidungen mit diesen Filtern neu lesen</translation>
    </message>
    <message>
        <source>Filter:</source>
        <translation>Filter:</translation>
    </message>
    <message>
        <source>Recorded decisions</source>
        <translation>Erfasste Entscheidungen</translation>
    </message>
    <message>
        <source>Newest first; select one to see its plan, two to compare them</source>
        <translation>Neueste zuerst; eine auswählen, um ihren Plan zu sehen, zwei, um sie zu vergleichen</translation>
    </message>
    <message>
        <source>Select one decision to see its plan, or two to compare them.</source>
        <translation>Eine Entscheidung auswählen, um ihren Plan zu sehen, oder zwei, um sie zu vergleichen.</translation>
    </message>
    <message>
        <source>Decision details</source>
        <translation>Einzelheiten der Entscheidung</translation>
    </message>
    <message>
        <source>The plan of the selected decision, or the changes between two</source>
        <translation>Der Plan der ausgewählten Entscheidung oder die Änderungen zwischen zweien</translation>
    </message>
    <message>
        <source>The history file these decisions come from (Edit ▸ Settings to change it)</source>
        <translation>Die Verlaufsdatei, aus der diese Entscheidungen stammen (Bearbeiten ▸ Einstellungen zum Ändern)</translation>
    </message>
    <message>
        <source>History file</source>
        <translation>Verlaufsdatei</translation>
    </message>
    <message>
        <source>&amp;Compare two</source>
        <translation>Zwei &amp;vergleichen</translation>
    </message>
    <message>
        <source>Select two decisions (Ctrl+click) and compare their plans</source>
        <translation>Zwei Entscheidungen auswählen (Strg+Klick) und ihre Pläne vergleichen</translation>
    </message>
    <message>
        <source>Compare two</source>
        <translation>Zwei vergleichen</translation>
    </message>
    <message>
        <source>Re&amp;store…</source>
        <translation>&amp;Wiederherstellen…</translation>
    </message>
    <message>
        <source>Record a new decision that puts this one&apos;s plan back in force</source>
        <translation>Eine neue Entscheidung erfassen, die den Plan dieser wieder in Kraft setzt</translation>
    </message>
    <message>
        <source>Restore</source>
        <translation>Wiederherstellen</translation>
    </message>
    <message>
        <source>File: {path}</source>
        <translation>Datei: {path}</translation>
    </message>
    <message>
        <source>Decision #{number} - {reason} by {supervisor}</source>
        <translation>Entscheidung Nr. {number} - {reason}, von {supervisor}</translation>
    </message>
    <message>
        <source>Total: {total} ({objective})</source>
        <translation>Summe: {total} ({objective})</translation>
    </message>
    <message>
        <source>▶ {machine}: {job} (running)</source>
        <translation>▶ {machine}: {job} (läuft)</translation>
    </message>
    <message>
        <source>Waiting: {jobs}</source>
        <translation>Wartend: {jobs}</translation>
    </message>
    <message>
        <source>Idle: {machines}</source>
        <translation>Frei: {machines}</translation>
    </message>
    <message>
        <source>Changes from #{number}:</source>
        <translation>Änderungen gegenüber Nr. {number}:</translation>
    </message>
    <message>
        <source>select exactly two decisions to compare</source>
        <translation>genau zwei Entscheidungen zum Vergleichen auswählen</translation>
    </message>
    <message>
        <source>From decision #{first} to #{second}:</source>
        <translation>Von Entscheidung Nr. {first} zu Nr. {second}:</translation>
    </message>
    <message>
        <source>select one decision to restore</source>
        <translation>eine Entscheidung zum Wiederherstellen auswählen</translation>
    </message>
</context>
<context>
    <name>JobImport</name>
    <message>
        <source>Import job list</source>
        <translation>Auftragsliste importieren</translation>
    </message>
    <message>
        <source>Job lists (*.csv *.tsv *.txt *.xlsx)</source>
        <translation>Auftragslisten (*.csv *.tsv *.txt *.xlsx)</translation>
    </message>
    <message>
        <source>job list not imported: {problem}</source>
        <translation>Auftragsliste nicht importiert: {problem}</translation>
    </message>
    <message>
        <source>job list not imported, nothing changed: {problem}</source>
        <translation>Auftragsliste nicht importiert, nichts geändert: {problem}</translation>
    </message>
    <message>
        <source>Import job list {file}</source>
        <translation>Auftragsliste {file} importieren</translation>
    </message>
    <message numerus="yes">
        <source>Job list imported: %n job(s) added</source>
        <translation>
            <numerusform>Auftragsliste importiert: %n Auftrag hinzugefügt</numerusform>
            <numerusform>Auftragsliste importiert: %n Aufträge hinzugefügt</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>%n updated</source>
        <translation>
            <numerusform>%n aktualisiert</numerusform>
            <numerusform>%n aktualisiert</numerusform>
        </translation>
    </message>
</context>
<context>
    <name>JobImportDialog</name>
    <message>
        <source>Import job list</source>
        <translation>Auftragsliste importieren</translation>
    </message>
    <message>
        <source>Which column of the file holds each field of a job</source>
        <translation>Welche Spalte der Datei welches Feld eines Auftrags enthält</translation>
    </message>
    <message numerus="yes">
        <source>{file}: %n job row(s). Choose the column that holds each field; jobs whose name is already in the shop are updated, the others added, waiting.</source>
        <translation>
            <numerusform>{file}: %n Auftragszeile. Die Spalte für jedes Feld wählen; Aufträge, deren Name schon im Betrieb steht, werden aktualisiert, die anderen wartend hinzugefügt.</numerusform>
            <numerusform>{file}: %n Auftragszeilen. Die Spalte für jedes Feld wählen; Aufträge, deren Name schon im Betrieb steht, werden aktualisiert, die anderen wartend hinzugefügt.</numerusform>
        </translation>
    </message>
    <message>
        <source>Work order</source>
        <translation>Arbeitsauftrag</translation>
    </message>
    <message>
        <source>Job name</source>
        <translation>Auftragsname</translation>
    </message>
    <message>
        <source>Setup family</source>
        <translation>Rüstfamilie</translation>
    </message>
    <message>
        <source>Run hours</source>
        <translation>Laufzeit (h)</translation>
    </message>
    <message>
        <source>Due</source>
        <translation>Fällig</translation>
    </message>
    <message>
        <source>Rush (yes/no)</source>
        <translation>Eilauftrag (ja/nein)</translation>
    </message>
    <message>
        <source>Wait penalty</source>
        <translation>Wartekosten</translation>
    </message>
    <message>
        <source>(not in the file)</source>
        <translation>(nicht in der Datei)</translation>
    </message>
    <message>
        <source>column {n}</source>
        <translation>Spalte {n}</translation>
    </message>
    <message>
        <source>The column of the file holding {field}</source>
        <translation>Die Spalte der Datei mit {field}</translation>
    </message>
    <message>
        <source>&amp;Import</source>
        <translation>&amp;Importieren</translation>
    </message>
</context>
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
        <source>{typed} typed over the changeover table   {mounted} mounted</source>
        <translation>{typed} über die Rüsttabelle getippt   {mounted} gerüstet</translation>
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
        <source>C&amp;hangeovers</source>
        <translation>Rüstwe&amp;chsel</translation>
    </message>
    <message>
        <source>Time&amp;line</source>
        <translation>&amp;Zeitachse</translation>
    </message>
    <message>
        <source>Views</source>
        <translation>Ansichten</translation>
    </message>
    <message>
        <source>Switch between the grid, the what-if map, the alternatives, the crew, the changeover tables and the timeline (Alt and the underlined letter)</source>
        <translation>Zwischen Raster, Was-wäre-wenn, Alternativen, Personal, Rüstwechseltabellen und Zeitachse wechseln (Alt und der unterstrichene Buchstabe)</translation>
    </message>
    <message>
        <source>Jobs as rows, machines as columns: type setup values, pin or forbid pairs</source>
        <translation>Aufträge als Zeilen, Maschinen als Spalten: Rüstwerte eingeben, Paare festlegen oder sperren</translation>
    </message>
    <message>
        <source>How much worse the plan gets if a job is forced onto a machine</source>
        <translation>Wie viel schlechter der Plan wird, wenn ein Auftrag auf eine Maschine gezwungen wird</translation>
    </message>
    <message>
        <source>The best few plans, best first, and what each changes</source>
        <translation>Die besten Pläne, der beste zuerst, und was jeder ändert</translation>
    </message>
    <message>
        <source>Operators: present, how many machines each minds, what they are authorised to run</source>
        <translation>Bediener: anwesend, wie viele Maschinen jeder betreut, wofür sie freigegeben sind</translation>
    </message>
    <message>
        <source>Changeover tables: the setup between job families on each machine</source>
        <translation>Rüstwechseltabellen: die Rüstzeit zwischen Auftragsfamilien je Maschine</translation>
    </message>
    <message>
        <source>Each machine&apos;s jobs over the shift in run order, with their changeovers</source>
        <translation>Die Aufträge jeder Maschine über die Schicht in Laufreihenfolge, mit ihren Rüstwechseln</translation>
    </message>
    <message>
        <source>Views of the shop</source>
        <translation>Ansichten des Betriebs</translation>
    </message>
    <message>
        <source>The grid, the what-if map, the alternatives, the crew, the changeover tables and the timeline</source>
        <translation>Das Raster, die Was-wäre-wenn-Karte, die Alternativen, das Personal, die Rüstwechseltabellen und die Zeitachse</translation>
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
        <source>Merge a grid file into this shop by job and machine names</source>
        <translation>Eine Rasterdatei nach Auftrags- und Maschinennamen in diesen Betrieb übernehmen</translation>
    </message>
    <message>
        <source>Import &amp;job list (CSV/XLSX)…</source>
        <translation>&amp;Auftragsliste importieren (CSV/XLSX)…</translation>
    </message>
    <message>
        <source>Add or update jobs from a planning system&apos;s job list, choosing which column holds each field</source>
        <translation>Aufträge aus der Auftragsliste eines Planungssystems hinzufügen oder aktualisieren, mit Wahl der Spalte für jedes Feld</translation>
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
        <source>The machine cannot run the job (selected cells)</source>
        <translation>Die Maschine kann den Auftrag nicht ausführen (ausgewählte Zellen)</translation>
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
        <source>Use changeover ta&amp;ble</source>
        <translation>Rüst&amp;tabelle verwenden</translation>
    </message>
    <message>
        <source>Drop the values typed in the selected cells: they follow the changeover table again</source>
        <translation>Die in den gewählten Zellen getippten Werte verwerfen: sie folgen wieder der Rüsttabelle</translation>
    </message>
    <message>
        <source>Mounted &amp;family…</source>
        <translation>Gerüstete &amp;Familie…</translation>
    </message>
    <message>
        <source>Which setup family the current machine has mounted now</source>
        <translation>Welche Rüstfamilie die aktuelle Maschine jetzt gerüstet hat</translation>
    </message>
    <message>
        <source>&amp;End family…</source>
        <translation>&amp;Endfamilie…</translation>
    </message>
    <message>
        <source>Which family the current machine must end the shift in</source>
        <translation>In welcher Familie die aktuelle Maschine die Schicht beenden muss</translation>
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
        <translation>Auftrag als er&amp;ledigt markieren</translation>
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
        <source>Import grid in&amp;to this shop…</source>
        <translation>Raster in diesen Betrieb &amp;übernehmen…</translation>
    </message>
    <message>
        <source>Mar&amp;k cannot run</source>
        <translation>Als nicht &amp;möglich markieren</translation>
    </message>
    <message>
        <source>P&amp;in job to this machine</source>
        <translation>Auftrag auf diese Maschine &amp;festlegen</translation>
    </message>
    <message>
        <source>Machine in mai&amp;ntenance</source>
        <translation>Maschine in &amp;Wartung</translation>
    </message>
    <message>
        <source>Solve again</source>
        <translation>Erneut berechnen</translation>
    </message>
    <message>
        <source>Re-s&amp;olve now</source>
        <translation>Jetzt neu &amp;berechnen</translation>
    </message>
    <message>
        <source>&amp;Cancel solve</source>
        <translation>Berechnung abbre&amp;chen</translation>
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
        <translation>Ganze Sc&amp;hicht (mehrere Aufträge je Maschine)</translation>
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
        <translation>Blatt als &amp;PDF exportieren…</translation>
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
    <name>Messenger</name>
    <message>
        <source>Unsaved changes</source>
        <translation>Ungespeicherte Änderungen</translation>
    </message>
</context>
<context>
    <name>PlanPanel</name>
    <message>
        <source>Least total (setup + wait penalties)</source>
        <extracomment>Waiting jobs listed one by one in the panel; the rest are counted (the grid shows all).</extracomment>
        <translation>Geringste Summe (Rüstzeit + Wartekosten)</translation>
    </message>
    <message>
        <source>Most total value (values are gains)</source>
        <translation>Größter Gesamtwert (Werte sind Gewinne)</translation>
    </message>
    <message>
        <source>Smallest largest single value, then least total</source>
        <translation>Kleinster größter Einzelwert, dann geringste Summe</translation>
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
        <source>What the plan optimises; changing it re-solves at once</source>
        <translation>Was der Plan optimiert; eine Änderung berechnet sofort neu</translation>
    </message>
    <message>
        <source>Objective</source>
        <translation>Ziel</translation>
    </message>
    <message>
        <source>Plan one dispatch round, or fill each machine&apos;s whole shift (needs run hours; may take longer, with progress and cancel)</source>
        <translation>Eine Zuteilungsrunde planen oder die ganze Schicht jeder Maschine füllen (braucht Laufzeiten; kann länger dauern, mit Fortschritt und Abbruch)</translation>
    </message>
    <message>
        <source>Planning mode</source>
        <translation>Planungsart</translation>
    </message>
    <message>
        <source>O&amp;bjective:</source>
        <translation>&amp;Ziel:</translation>
    </message>
    <message>
        <source>Mo&amp;de:</source>
        <translation>&amp;Art:</translation>
    </message>
    <message>
        <source>Plan total</source>
        <translation>Plansumme</translation>
    </message>
    <message>
        <source>The plan&apos;s total and what it is made of</source>
        <translation>Die Summe des Plans und woraus sie besteht</translation>
    </message>
    <message>
        <source>Total:</source>
        <translation>Summe:</translation>
    </message>
    <message>
        <source>Jobs placed</source>
        <translation>Eingeplante Aufträge</translation>
    </message>
    <message>
        <source>Jobs dispatched, running and waiting</source>
        <translation>Zugeteilte, laufende und wartende Aufträge</translation>
    </message>
    <message>
        <source>Placed:</source>
        <translation>Eingeplant:</translation>
    </message>
    <message>
        <source>Proof of optimality</source>
        <translation>Nachweis der Optimalität</translation>
    </message>
    <message>
        <source>Whether the plan is proven the best</source>
        <translation>Ob der Plan nachweislich der beste ist</translation>
    </message>
    <message>
        <source>Proof:</source>
        <translation>Nachweis:</translation>
    </message>
    <message>
        <source>No plan yet</source>
        <translation>Noch kein Plan</translation>
    </message>
    <message>
        <source>Plan status</source>
        <translation>Planstatus</translation>
    </message>
    <message>
        <source>Whether the plan shown is up to date, and why not</source>
        <translation>Ob der angezeigte Plan aktuell ist, und warum nicht</translation>
    </message>
    <message>
        <source>Solving in the background; the grid stays editable</source>
        <translation>Berechnung im Hintergrund; das Raster bleibt bearbeitbar</translation>
    </message>
    <message>
        <source>Solving</source>
        <translation>Berechnung</translation>
    </message>
    <message>
        <source>Cancel</source>
        <translation>Abbrechen</translation>
    </message>
    <message>
        <source>Stop waiting for this solve (Esc)</source>
        <translation>Nicht länger auf diese Berechnung warten (Esc)</translation>
    </message>
    <message>
        <source>Cancel solve</source>
        <translation>Berechnung abbrechen</translation>
    </message>
    <message>
        <source>Machine</source>
        <translation>Maschine</translation>
    </message>
    <message>
        <source>Job / why it waits</source>
        <translation>Auftrag / warum er wartet</translation>
    </message>
    <message>
        <source>Value</source>
        <translation>Wert</translation>
    </message>
    <message>
        <source>Plan by machine</source>
        <translation>Plan nach Maschinen</translation>
    </message>
    <message>
        <source>Each machine&apos;s jobs, the waiting jobs with their reasons, the crew and idle machines</source>
        <translation>Die Aufträge jeder Maschine, die wartenden Aufträge mit Gründen, das Personal und freie Maschinen</translation>
    </message>
    <message>
        <source>Solving… {progress}</source>
        <translation>Berechnung läuft… {progress}</translation>
    </message>
    <message>
        <source>Solving…</source>
        <translation>Berechnung läuft…</translation>
    </message>
    <message>
        <source>… (hover for all)</source>
        <translation>… (alles im Tooltip)</translation>
    </message>
    <message>
        <source>{mark} No plan: {why}</source>
        <translation>{mark} Kein Plan: {why}</translation>
    </message>
    <message>
        <source>Solve cancelled; the plan shown is out of date (edit or F5 to re-solve)</source>
        <translation>Berechnung abgebrochen; der angezeigte Plan ist veraltet (ändern oder F5 zum Neuberechnen)</translation>
    </message>
    <message>
        <source>runs {job} with no qualified operator present</source>
        <translation>führt {job} aus, ohne dass ein qualifizierter Bediener anwesend ist</translation>
    </message>
    <message>
        <source>Stop it only by the site&apos;s procedure: the plan never stops a running machine</source>
        <translation>Nur nach dem Verfahren des Standorts anhalten: der Plan hält nie eine laufende Maschine an</translation>
    </message>
    <message>
        <source>{mark} short of operators</source>
        <translation>{mark} zu wenig Bediener</translation>
    </message>
    <message numerus="yes">
        <source>%n job(s) wait for an operator</source>
        <translation>
            <numerusform>%n Auftrag wartet auf einen Bediener</numerusform>
            <numerusform>%n Aufträge warten auf einen Bediener</numerusform>
        </translation>
    </message>
    <message>
        <source>authorisation ends {date}</source>
        <translation>Befugnis endet am {date}</translation>
    </message>
    <message>
        <source>not here yet</source>
        <translation>noch nicht da</translation>
    </message>
    <message>
        <source>{operator} arrives later in the shift</source>
        <translation>{operator} kommt später in der Schicht</translation>
    </message>
    <message>
        <source>absent</source>
        <translation>abwesend</translation>
    </message>
    <message>
        <source>{operator} is absent this shift</source>
        <translation>{operator} fehlt in dieser Schicht</translation>
    </message>
    <message numerus="yes">
        <source>Crew (%n present)</source>
        <translation>
            <numerusform>Personal (%n anwesend)</numerusform>
            <numerusform>Personal (%n anwesend)</numerusform>
        </translation>
    </message>
    <message>
        <source>every machine in the plan is staffed</source>
        <translation>jede Maschine im Plan ist besetzt</translation>
    </message>
    <message>
        <source>{mark} Up to date (solved in {ms} ms)</source>
        <translation>{mark} Aktuell (berechnet in {ms} ms)</translation>
    </message>
    <message>
        <source>The plan shown matches the grid as it is now</source>
        <translation>Der angezeigte Plan passt zum Raster, wie es jetzt ist</translation>
    </message>
    <message>
        <source>Sum of the values of newly dispatched jobs minus the wait penalties of waiting jobs (running jobs are not counted)</source>
        <translation>Summe der Werte neu zugeteilter Aufträge minus die Wartekosten wartender Aufträge (laufende Aufträge zählen nicht)</translation>
    </message>
    <message>
        <source>Sum of the values of newly dispatched jobs plus the wait penalties of waiting jobs (running jobs are not counted)</source>
        <translation>Summe der Werte neu zugeteilter Aufträge plus die Wartekosten wartender Aufträge (laufende Aufträge zählen nicht)</translation>
    </message>
    <message>
        <source>{dispatched} dispatched, {running} running, {waiting} waiting</source>
        <translation>zugeteilt: {dispatched}, laufend: {running}, wartend: {waiting}</translation>
    </message>
    <message>
        <source>Jobs newly dispatched this round, jobs already running, jobs waiting</source>
        <translation>In dieser Runde neu zugeteilte Aufträge, bereits laufende Aufträge, wartende Aufträge</translation>
    </message>
    <message>
        <source>{mark} optimal (proven by the MILP solver)</source>
        <translation>{mark} optimal (vom MILP-Löser bewiesen)</translation>
    </message>
    <message>
        <source>{mark} optimal (certificate checked)</source>
        <translation>{mark} optimal (Zertifikat geprüft)</translation>
    </message>
    <message>
        <source>Dual potentials prove no other plan placing as many jobs has a better total</source>
        <translation>Duale Potenziale beweisen, dass kein anderer Plan mit ebenso vielen eingeplanten Aufträgen eine bessere Summe hat</translation>
    </message>
    <message>
        <source>{mark} certificate did NOT check</source>
        <translation>{mark} Zertifikat NICHT bestätigt</translation>
    </message>
    <message>
        <source>; largest value {value}</source>
        <translation>; größter Wert {value}</translation>
    </message>
    <message>
        <source>unattended</source>
        <translation>unbeaufsichtigt</translation>
    </message>
    <message numerus="yes">
        <source>Machines (%n)</source>
        <translation>
            <numerusform>Maschinen (%n)</numerusform>
            <numerusform>Maschinen (%n)</numerusform>
        </translation>
    </message>
    <message>
        <source>{used} of {hours} h used</source>
        <translation>{used} von {hours} h belegt</translation>
    </message>
    <message>
        <source>Run hours planned on {machine} this shift, of the hours it has</source>
        <translation>Auf {machine} in dieser Schicht geplante Laufstunden, von ihren verfügbaren Stunden</translation>
    </message>
    <message>
        <source>Position {n} in {machine}&apos;s run order</source>
        <translation>Position {n} in der Reihenfolge von {machine}</translation>
    </message>
    <message>
        <source>{machine} is minded by {operator} in this plan</source>
        <translation>{machine} wird in diesem Plan von {operator} bedient</translation>
    </message>
    <message>
        <source>Value of {job} on {machine} ({unit}) - already running, not counted in the total</source>
        <translation>Wert von {job} auf {machine} ({unit}) - läuft bereits, zählt nicht zur Summe</translation>
    </message>
    <message>
        <source>Value of {job} on {machine} ({unit})</source>
        <translation>Wert von {job} auf {machine} ({unit})</translation>
    </message>
    <message>
        <source>already running, stays</source>
        <translation>läuft bereits, bleibt</translation>
    </message>
    <message>
        <source>newly dispatched</source>
        <translation>neu zugeteilt</translation>
    </message>
    <message numerus="yes">
        <source>Waiting jobs (%n)</source>
        <translation>
            <numerusform>Wartende Aufträge (%n)</numerusform>
            <numerusform>Wartende Aufträge (%n)</numerusform>
        </translation>
    </message>
    <message>
        <source>{jobs} for {machines}</source>
        <translation>{jobs} für {machines}</translation>
    </message>
    <message numerus="yes">
        <source>%n job(s)</source>
        <translation>
            <numerusform>%n Auftrag</numerusform>
            <numerusform>%n Aufträge</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>%n machine(s)</source>
        <translation>
            <numerusform>%n Maschine</numerusform>
            <numerusform>%n Maschinen</numerusform>
        </translation>
    </message>
    <message>
        <source>no available machine can run it</source>
        <translation>keine verfügbare Maschine kann ihn ausführen</translation>
    </message>
    <message>
        <source>cheaper to leave it waiting</source>
        <translation>Warten ist günstiger</translation>
    </message>
    <message>
        <source>left waiting: cheaper overall</source>
        <translation>wartet: insgesamt günstiger</translation>
    </message>
    <message numerus="yes">
        <source>… and %n more</source>
        <translation>
            <numerusform>… und %n weiterer</numerusform>
            <numerusform>… und %n weitere</numerusform>
        </translation>
    </message>
    <message>
        <source>see the grid&apos;s &apos;Plan puts it on&apos; column</source>
        <translation>siehe die Spalte &apos;Plan setzt ihn auf&apos; im Raster</translation>
    </message>
    <message>
        <source>Long lists are cut here to keep the window quick; every job&apos;s place or reason is in the grid</source>
        <translation>Lange Listen werden hier gekürzt, damit das Fenster schnell bleibt; Platz oder Grund jedes Auftrags steht im Raster</translation>
    </message>
    <message numerus="yes">
        <source>Idle machines (%n)</source>
        <translation>
            <numerusform>Freie Maschinen (%n)</numerusform>
            <numerusform>Freie Maschinen (%n)</numerusform>
        </translation>
    </message>
    <message>
        <source>no job this round</source>
        <translation>kein Auftrag in dieser Runde</translation>
    </message>
    <message numerus="yes">
        <source>Not available (%n)</source>
        <translation>
            <numerusform>Nicht verfügbar (%n)</numerusform>
            <numerusform>Nicht verfügbar (%n)</numerusform>
        </translation>
    </message>
    <message>
        <source>down or in maintenance - lockout/tagout before any work</source>
        <translation>ausgefallen oder in Wartung - vor jeder Arbeit Sperren und Kennzeichnen (LOTO)</translation>
    </message>
    <message>
        <source>values</source>
        <translation>Werte</translation>
    </message>
    <message>
        <source>costs</source>
        <translation>Kosten</translation>
    </message>
    <message>
        <source>setups</source>
        <translation>Rüstzeiten</translation>
    </message>
    <message>
        <source> ({planned_word} {planned} - wait penalties {penalties})</source>
        <translation> ({planned_word} {planned} - Wartekosten {penalties})</translation>
    </message>
    <message>
        <source> ({planned_word} {planned} + wait penalties {penalties})</source>
        <translation> ({planned_word} {planned} + Wartekosten {penalties})</translation>
    </message>
</context>
<context>
    <name>SettingsController</name>
    <message>
        <source>Settings not changed</source>
        <translation>Einstellungen nicht geändert</translation>
    </message>
    <message>
        <source>Choose a history file.</source>
        <translation>Eine Verlaufsdatei wählen.</translation>
    </message>
    <message>
        <source>History file not changed</source>
        <translation>Verlaufsdatei nicht geändert</translation>
    </message>
    <message>
        <source>{error}

Decisions are still recorded in {path}.</source>
        <translation>{error}

Entscheidungen werden weiter in {path} erfasst.</translation>
    </message>
    <message>
        <source>Decisions are now recorded in {path}</source>
        <translation>Entscheidungen werden jetzt in {path} erfasst</translation>
    </message>
    <message>
        <source>The new language applies at the next start</source>
        <translation>Die neue Sprache gilt ab dem nächsten Start</translation>
    </message>
</context>
<context>
    <name>SettingsDialog</name>
    <message>
        <source>History file: choose an existing one or name a new one</source>
        <translation>Verlaufsdatei: eine vorhandene wählen oder eine neue benennen</translation>
    </message>
    <message>
        <source>Decision histories (*.sqlite);;All files (*)</source>
        <translation>Entscheidungsverläufe (*.sqlite);;Alle Dateien (*)</translation>
    </message>
    <message>
        <source>{path}: is a folder, not a history file</source>
        <translation>{path}: ist ein Ordner, keine Verlaufsdatei</translation>
    </message>
    <message>
        <source>{path}: the file is read-only, so no decision could be recorded in it; it was left as it is. Make it writable or choose another file</source>
        <translation>{path}: die Datei ist schreibgeschützt, daher könnte keine Entscheidung darin erfasst werden; sie wurde unverändert gelassen. Sie beschreibbar machen oder eine andere Datei wählen</translation>
    </message>
    <message>
        <source>{path}: the folder {folder} does not exist</source>
        <translation>{path}: der Ordner {folder} existiert nicht</translation>
    </message>
    <message>
        <source>{path}: the folder {folder} is not writable, so the history cannot be created there</source>
        <translation>{path}: der Ordner {folder} ist nicht beschreibbar, daher kann der Verlauf dort nicht angelegt werden</translation>
    </message>
    <message>
        <source>Settings</source>
        <translation>Einstellungen</translation>
    </message>
    <message>
        <source>The file every confirmed decision is recorded in</source>
        <translation>Die Datei, in der jede bestätigte Entscheidung erfasst wird</translation>
    </message>
    <message>
        <source>History file</source>
        <translation>Verlaufsdatei</translation>
    </message>
    <message>
        <source>&amp;Choose…</source>
        <translation>&amp;Wählen…</translation>
    </message>
    <message>
        <source>Pick an existing history file, or name a new one</source>
        <translation>Eine vorhandene Verlaufsdatei wählen oder eine neue benennen</translation>
    </message>
    <message>
        <source>Choose history file</source>
        <translation>Verlaufsdatei wählen</translation>
    </message>
    <message>
        <source>Use &amp;default</source>
        <translation>&amp;Vorgabe verwenden</translation>
    </message>
    <message>
        <source>The per-user file: {path}</source>
        <translation>Die Datei je Benutzer: {path}</translation>
    </message>
    <message>
        <source>Use the default history file</source>
        <translation>Die vorgegebene Verlaufsdatei verwenden</translation>
    </message>
    <message>
        <source>&amp;History file:</source>
        <translation>&amp;Verlaufsdatei:</translation>
    </message>
    <message>
        <source>Confirmed decisions are recorded in this file. Another file takes effect at once: the history panel then lists its decisions. A new name starts an empty history; nothing is copied or deleted.</source>
        <translation>Bestätigte Entscheidungen werden in dieser Datei erfasst. Eine andere Datei gilt sofort: der Verlauf zeigt dann ihre Entscheidungen. Ein neuer Name beginnt einen leeren Verlauf; nichts wird kopiert oder gelöscht.</translation>
    </message>
    <message>
        <source>About the history file</source>
        <translation>Zur Verlaufsdatei</translation>
    </message>
    <message>
        <source>Several stations share one history on a PostgreSQL server: enter postgresql://host/database or service=NAME instead of a file (the password comes from the password or service file, never from here).</source>
        <translation>Mehrere Stationen teilen eine Historie auf einem PostgreSQL-Server: statt einer Datei postgresql://host/datenbank oder service=NAME eingeben (das Passwort kommt aus der Passwort- oder Dienstdatei, nie von hier).</translation>
    </message>
    <message>
        <source>About a shared history</source>
        <translation>Über eine gemeinsame Historie</translation>
    </message>
    <message>
        <source>PostgreSQL driver</source>
        <translation>PostgreSQL-Treiber</translation>
    </message>
    <message>
        <source>Says when the chosen PostgreSQL history cannot be used because its driver is not installed</source>
        <translation>Zeigt an, wenn die gewählte PostgreSQL-Historie nicht nutzbar ist, weil ihr Treiber nicht installiert ist</translation>
    </message>
    <message>
        <source>for example: A. Supervisor</source>
        <translation>zum Beispiel: A. Schichtleitung</translation>
    </message>
    <message>
        <source>Filled in when you confirm a decision (you can change it there)</source>
        <translation>Wird beim Bestätigen einer Entscheidung eingetragen (dort änderbar)</translation>
    </message>
    <message>
        <source>Default supervisor</source>
        <translation>Vorgegebene Schichtleitung</translation>
    </message>
    <message>
        <source>Default &amp;supervisor:</source>
        <translation>Vorgegebene &amp;Schichtleitung:</translation>
    </message>
    <message>
        <source>empty: {host}</source>
        <translation>leer: {host}</translation>
    </message>
    <message>
        <source>Recorded with every decision made here, so other stations see where it was decided; empty records {host}</source>
        <translation>Wird mit jeder hier getroffenen Entscheidung gespeichert, damit andere Stationen sehen, wo entschieden wurde; leer speichert {host}</translation>
    </message>
    <message>
        <source>Station label</source>
        <translation>Stationsbezeichnung</translation>
    </message>
    <message>
        <source>The name of this station recorded with every decision; empty records the host name</source>
        <translation>Der Name dieser Station, der mit jeder Entscheidung gespeichert wird; leer speichert den Rechnernamen</translation>
    </message>
    <message>
        <source>Station &amp;label:</source>
        <translation>Stations&amp;bezeichnung:</translation>
    </message>
    <message>
        <source> min</source>
        <translation> min</translation>
    </message>
    <message>
        <source>How often unsaved changes are copied to the recovery folder</source>
        <translation>Wie oft ungesicherte Änderungen in den Wiederherstellungsordner kopiert werden</translation>
    </message>
    <message>
        <source>Autosave interval</source>
        <translation>Intervall der automatischen Sicherung</translation>
    </message>
    <message>
        <source>&amp;Autosave every:</source>
        <translation>&amp;Automatisch sichern alle:</translation>
    </message>
    <message>
        <source>System language</source>
        <translation>Sprache des Systems</translation>
    </message>
    <message>
        <source>The interface and printed sheet language; applies at the next start</source>
        <translation>Die Sprache der Oberfläche und des gedruckten Blatts; gilt ab dem nächsten Start</translation>
    </message>
    <message>
        <source>Language</source>
        <translation>Sprache</translation>
    </message>
    <message>
        <source>&amp;Language:</source>
        <translation>S&amp;prache:</translation>
    </message>
    <message>
        <source>Apply settings</source>
        <translation>Einstellungen übernehmen</translation>
    </message>
    <message>
        <source>Use these settings; a refused history file keeps the dialog open</source>
        <translation>Diese Einstellungen verwenden; bei einer abgelehnten Verlaufsdatei bleibt der Dialog offen</translation>
    </message>
    <message>
        <source>Cancel</source>
        <translation>Abbrechen</translation>
    </message>
    <message>
        <source>Close without changing anything</source>
        <translation>Schließen, ohne etwas zu ändern</translation>
    </message>
    <message>
        <source>Cannot be used here: {problem}</source>
        <translation>Hier nicht nutzbar: {problem}</translation>
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
        <translation>Vor jeder Arbeit an einer ausgefallenen Maschine Sperren und Kennzeichnen (LOTO) anwenden.</translation>
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
            <numerusform>Ausgefallene Maschinen (%n) - vor jeder Arbeit Sperren und Kennzeichnen (LOTO)</numerusform>
            <numerusform>Ausgefallene Maschinen (%n) - vor jeder Arbeit Sperren und Kennzeichnen (LOTO)</numerusform>
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
        <source>Every running machine has a present, authorised operator.</source>
        <translation>Jede laufende Maschine hat einen anwesenden, befugten Bediener.</translation>
    </message>
    <message>
        <source>Crew</source>
        <translation>Personal</translation>
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
<context>
    <name>SheetPrinting</name>
    <message>
        <source>Nothing to print</source>
        <translation>Nichts zu drucken</translation>
    </message>
    <message>
        <source>There is no plan yet: fix the grid first.</source>
        <translation>Es gibt noch keinen Plan: zuerst das Raster korrigieren.</translation>
    </message>
    <message>
        <source>PDF not written</source>
        <translation>PDF nicht geschrieben</translation>
    </message>
    <message numerus="yes">
        <source>Wrote %n page(s) to {path}</source>
        <translation>
            <numerusform>%n Seite nach {path} geschrieben</numerusform>
            <numerusform>%n Seiten nach {path} geschrieben</numerusform>
        </translation>
    </message>
    <message>
        <source>Dispatch sheet - print preview</source>
        <translation>Zuteilungsblatt - Druckvorschau</translation>
    </message>
    <message>
        <source>Export dispatch sheet</source>
        <translation>Zuteilungsblatt exportieren</translation>
    </message>
    <message>
        <source>PDF (*.pdf)</source>
        <translation>PDF (*.pdf)</translation>
    </message>
</context>
<context>
    <name>ShopDocument</name>
    <message>
        <source>Untitled shop</source>
        <translation>Unbenannter Betrieb</translation>
    </message>
</context>
<context>
    <name>TimelineTab</name>
    <message>
        <source>Timeline</source>
        <translation>Zeitachse</translation>
    </message>
    <message>
        <source>The whole-shift plan drawn per machine on the shift&apos;s hours</source>
        <translation>Der Plan der ganzen Schicht je Maschine über die Stunden der Schicht gezeichnet</translation>
    </message>
    <message>
        <source>Solid: a planned job   dotted: already running   hatched: changeover before the job   cross-hatched: change into the end family   dashed line: end of the machine&apos;s hours</source>
        <translation>Voll: ein geplanter Auftrag   gepunktet: läuft bereits   schraffiert: Rüstwechsel vor dem Auftrag   kreuzschraffiert: Wechsel in die Endfamilie   gestrichelte Linie: Ende der Maschinenstunden</translation>
    </message>
    <message>
        <source>The timeline shows whole-shift plans: choose Plan &gt; Whole shift (Ctrl+5).</source>
        <translation>Die Zeitachse zeigt Pläne für die ganze Schicht: Plan &gt; Ganze Schicht wählen (Strg+5).</translation>
    </message>
    <message>
        <source>proven optimal</source>
        <translation>nachweislich optimal</translation>
    </message>
    <message>
        <source>gap at most {gap} % (proven lower bound {bound})</source>
        <translation>Lücke höchstens {gap} % (bewiesene untere Schranke {bound})</translation>
    </message>
    <message>
        <source>Whole-shift plan: total {total} {unit}, {gap}.</source>
        <translation>Plan der ganzen Schicht: Summe {total} {unit}, {gap}.</translation>
    </message>
</context>
<context>
    <name>TimelineView</name>
    <message>
        <source>Shift timeline</source>
        <extracomment>Fill colour and pattern of each kind of bar (never colour alone).</extracomment>
        <translation>Schicht-Zeitachse</translation>
    </message>
    <message>
        <source>One lane per machine; a bar per job on the shift&apos;s hours, changeovers hatched; arrow keys step through the bars</source>
        <translation>Eine Bahn je Maschine; ein Balken je Auftrag über die Schichtstunden, Rüstwechsel schraffiert; die Pfeiltasten gehen die Balken durch</translation>
    </message>
    <message>
        <source>{hours} h</source>
        <translation>{hours} h</translation>
    </message>
    <message>
        <source>no family</source>
        <translation>keine Familie</translation>
    </message>
    <message>
        <source>{start} to {end}</source>
        <translation>{start} bis {end}</translation>
    </message>
    <message>
        <source>{machine}: {job} already running ({family}), until {end}</source>
        <translation>{machine}: {job} läuft bereits ({family}), bis {end}</translation>
    </message>
    <message>
        <source>{machine}: change from {a} to the end family {b}: {value} {unit}, {span}</source>
        <translation>{machine}: Wechsel von {a} in die Endfamilie {b}: {value} {unit}, {span}</translation>
    </message>
    <message>
        <source>nothing mounted</source>
        <translation>nichts gerüstet</translation>
    </message>
    <message>
        <source>change from {a} to {b}: {value} {unit}</source>
        <translation>Wechsel von {a} zu {b}: {value} {unit}</translation>
    </message>
    <message>
        <source>no changeover priced</source>
        <translation>kein Rüstwechsel bewertet</translation>
    </message>
    <message>
        <source>{machine}: before {job}, {change} ({span})</source>
        <translation>{machine}: vor {job}, {change} ({span})</translation>
    </message>
    <message>
        <source>{machine}: {job}, family {family}, {span}; {change}</source>
        <translation>{machine}: {job}, Familie {family}, {span}; {change}</translation>
    </message>
</context>
<context>
    <name>WhatIfModel</name>
    <message>
        <source>down</source>
        <translation>ausgefallen</translation>
    </message>
    <message>
        <source>maintenance</source>
        <translation>Wartung</translation>
    </message>
    <message>
        <source>less value</source>
        <translation>weniger Wert</translation>
    </message>
    <message>
        <source>more</source>
        <translation>mehr</translation>
    </message>
    <message>
        <source>{job} on {machine}: value - (cannot run)</source>
        <translation>{job} auf {machine}: Wert - (nicht möglich)</translation>
    </message>
    <message>
        <source>{job} on {machine}: value {value} {unit}</source>
        <translation>{job} auf {machine}: Wert {value} {unit}</translation>
    </message>
    <message>
        <source>{job} is {state}: it is not dispatched this round</source>
        <translation>{job} ist {state}: er wird in dieser Runde nicht zugeteilt</translation>
    </message>
    <message>
        <source>running</source>
        <translation>laufend</translation>
    </message>
    <message>
        <source>done</source>
        <translation>erledigt</translation>
    </message>
    <message>
        <source>The plan puts {job} on {machine} (value {value})</source>
        <translation>Der Plan setzt {job} auf {machine} (Wert {value})</translation>
    </message>
    <message>
        <source>The plan leaves {job} waiting</source>
        <translation>Der Plan lässt {job} warten</translation>
    </message>
    <message>
        <source>Best other machine: {machine} (+{extra} {more} in total)</source>
        <translation>Beste andere Maschine: {machine} (+{extra} {more} insgesamt)</translation>
    </message>
    <message>
        <source>No other machine can take it in any plan</source>
        <translation>Keine andere Maschine kann ihn in irgendeinem Plan übernehmen</translation>
    </message>
    <message>
        <source>This is the plan&apos;s choice: extra cost 0</source>
        <translation>Das ist die Wahl des Plans: Mehrkosten 0</translation>
    </message>
    <message>
        <source>Forcing this pair is impossible: no plan placing as many jobs contains it</source>
        <translation>Dieses Paar zu erzwingen ist unmöglich: kein Plan mit ebenso vielen eingeplanten Aufträgen enthält es</translation>
    </message>
    <message>
        <source>Forcing this pair: +{extra} {more} in total than the plan</source>
        <translation>Dieses Paar erzwingen: +{extra} {more} insgesamt als der Plan</translation>
    </message>
    <message>
        <source>Keeping it waiting instead: +{extra}</source>
        <translation>Ihn stattdessen warten lassen: +{extra}</translation>
    </message>
</context>
<context>
    <name>WhatIfTab</name>
    <message>
        <source>what-if costs failed: {error}</source>
        <translation>Was-wäre-wenn-Kosten fehlgeschlagen: {error}</translation>
    </message>
    <message>
        <source>What-if costs cancelled</source>
        <translation>Was-wäre-wenn-Kosten abgebrochen</translation>
    </message>
    <message>
        <source>No plan yet</source>
        <translation>Noch kein Plan</translation>
    </message>
    <message>
        <source>What-if costs are for one dispatch round (Plan menu: One round)</source>
        <translation>Was-wäre-wenn-Kosten gelten für eine Zuteilungsrunde (Menü Plan: Eine Runde)</translation>
    </message>
    <message>
        <source>What-if costs are for the &apos;least total&apos; and &apos;most value&apos; objectives (switch in the Plan menu)</source>
        <translation>Was-wäre-wenn-Kosten gelten für die Ziele &apos;Geringste Summe&apos; und &apos;Größter Wert&apos; (im Menü Plan umschalten)</translation>
    </message>
    <message>
        <source>Computing…</source>
        <translation>Wird berechnet…</translation>
    </message>
</context>
<context>
    <name>WhatIfView</name>
    <message>
        <source>Extra cost against the plan shown if a job is forced onto a machine. {planned} = the plan&apos;s choice (0); darker = dearer; {cannot} = impossible; {idle} = running or done. Hover a cell for details.</source>
        <translation>Mehrkosten gegenüber dem angezeigten Plan, wenn ein Auftrag auf eine Maschine gezwungen wird. {planned} = Wahl des Plans (0); dunkler = teurer; {cannot} = unmöglich; {idle} = läuft oder erledigt. Für Einzelheiten auf eine Zelle zeigen.</translation>
    </message>
    <message>
        <source>What the map shows</source>
        <translation>Was die Karte zeigt</translation>
    </message>
    <message>
        <source>What-if status</source>
        <translation>Was-wäre-wenn-Status</translation>
    </message>
    <message>
        <source>The dearest forced pair, or why the map is empty</source>
        <translation>Das teuerste erzwungene Paar, oder warum die Karte leer ist</translation>
    </message>
    <message>
        <source>What-if map</source>
        <translation>Was-wäre-wenn-Karte</translation>
    </message>
    <message>
        <source>Jobs as rows, machines as columns: the extra cost if the job is forced onto the machine</source>
        <translation>Aufträge als Zeilen, Maschinen als Spalten: die Mehrkosten, wenn der Auftrag auf die Maschine gezwungen wird</translation>
    </message>
    <message>
        <source>Largest extra: {extra} {unit}</source>
        <translation>Größte Mehrkosten: {extra} {unit}</translation>
    </message>
    <message>
        <source>The dearest single forced pair, against the plan shown</source>
        <translation>Das teuerste einzelne erzwungene Paar, gegenüber dem angezeigten Plan</translation>
    </message>
</context>
</TS>
