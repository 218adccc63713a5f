<?xml version="1.0" encoding="utf-8"?>
<!DOCTYPE TS>
<TS version="2.1" language="en_US">
<context>
    <name>AlternativesView</name>
    <message numerus="yes">
        <source>%n distinct plan(s) found near the best (machines that take several jobs repeat the same plan in other slots), best first</source>
        <translation>
            <numerusform>%n distinct plan found near the best (machines that take several jobs repeat the same plan in other slots), best first</numerusform>
            <numerusform>%n distinct plans found near the best (machines that take several jobs repeat the same plan in other slots), best first</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>%n best plan(s), best first</source>
        <translation>
            <numerusform>%n best plan, best first</numerusform>
            <numerusform>%n best plans, best first</numerusform>
        </translation>
    </message>
</context>
<context>
    <name>ChangeoverModel</name>
    <message numerus="yes">
        <source>Paste %n changeover(s)</source>
        <translation>
            <numerusform>Paste %n changeover</numerusform>
            <numerusform>Paste %n changeovers</numerusform>
        </translation>
    </message>
</context>
<context>
    <name>ChangeoverTab</name>
    <message numerus="yes">
        <source>Pasted; %n changeover(s) changed</source>
        <translation>
            <numerusform>Pasted; %n changeover changed</numerusform>
            <numerusform>Pasted; %n changeovers changed</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>Disallow %n changeover(s)</source>
        <translation>
            <numerusform>Disallow %n changeover</numerusform>
            <numerusform>Disallow %n changeovers</numerusform>
        </translation>
    </message>
</context>
<context>
    <name>CrewModel</name>
    <message numerus="yes">
        <source>, expired %n day(s) ago (counts as none)</source>
        <translation>
            <numerusform>, expired %n day ago (counts as none)</numerusform>
            <numerusform>, expired %n days ago (counts as none)</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>, expires in %n day(s)</source>
        <translation>
            <numerusform>, expires in %n day</numerusform>
            <numerusform>, expires in %n days</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>{operator} minds %n machine(s)</source>
        <translation>
            <numerusform>{operator} minds %n machine</numerusform>
            <numerusform>{operator} minds %n machines</numerusform>
        </translation>
    </message>
</context>
<context>
    <name>CrewTab</name>
    <message numerus="yes">
        <source>Warn %n day(s) before an authorisation expires</source>
        <translation>
            <numerusform>Warn %n day before an authorisation expires</numerusform>
            <numerusform>Warn %n days before an authorisation expires</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>Withdraw %n authorisation(s)</source>
        <translation>
            <numerusform>Withdraw %n authorisation</numerusform>
            <numerusform>Withdraw %n authorisations</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>Paste %n authorisation(s)</source>
        <translation>
            <numerusform>Paste %n authorisation</numerusform>
            <numerusform>Paste %n authorisations</numerusform>
        </translation>
    </message>
</context>
<context>
    <name>GridEdits</name>
    <message numerus="yes">
        <source>Paste %n cell(s)</source>
        <translation>
            <numerusform>Paste %n cell</numerusform>
            <numerusform>Paste %n cells</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>Pasted; %n cell(s) changed</source>
        <translation>
            <numerusform>Pasted; %n cell changed</numerusform>
            <numerusform>Pasted; %n cells changed</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>Mark %n cell(s) cannot run</source>
        <translation>
            <numerusform>Mark %n cell cannot run</numerusform>
            <numerusform>Mark %n cells cannot run</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>{machine} takes %n job(s)</source>
        <translation>
            <numerusform>{machine} takes %n job</numerusform>
            <numerusform>{machine} takes %n jobs</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>Use changeover table in %n cell(s)</source>
        <translation>
            <numerusform>Use changeover table in %n cell</numerusform>
            <numerusform>Use changeover table in %n cells</numerusform>
        </translation>
    </message>
</context>
<context>
    <name>GridModel</name>
    <message numerus="yes">
        <source>{machine}: {state}, takes %n job(s) per round</source>
        <translation>
            <numerusform>{machine}: {state}, takes %n job per round</numerusform>
            <numerusform>{machine}: {state}, takes %n jobs per round</numerusform>
        </translation>
    </message>
</context>
<context>
    <name>GroupsDialog</name>
    <message numerus="yes">
        <source>%n authorisation(s) through the deleted group go with it</source>
        <translation>
            <numerusform>%n authorisation through the deleted group goes with it</numerusform>
            <numerusform>%n authorisations through the deleted group go with it</numerusform>
        </translation>
    </message>
</context>
<context>
    <name>JobImport</name>
    <message numerus="yes">
        <source>Job list imported: %n job(s) added</source>
        <translation>
            <numerusform>Job list imported: %n job added</numerusform>
            <numerusform>Job list imported: %n jobs added</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>%n updated</source>
        <translation>
            <numerusform>%n updated</numerusform>
            <numerusform>%n updated</numerusform>
        </translation>
    </message>
</context>
<context>
    <name>JobImportDialog</name>
    <message numerus="yes">
        <source>{file}: %n job row(s). Choose the column that holds each field; jobs whose name is already in the shop are updated, the others added, waiting.</source>
        <translation>
            <numerusform>{file}: %n job row. Choose the column that holds each field; jobs whose name is already in the shop are updated, the others added, waiting.</numerusform>
            <numerusform>{file}: %n job rows. Choose the column that holds each field; jobs whose name is already in the shop are updated, the others added, waiting.</numerusform>
        </translation>
    </message>
</context>
<context>
    <name>PlanPanel</name>
    <message numerus="yes">
        <source>%n job(s) wait for an operator</source>
        <translation>
            <numerusform>%n job waits for an operator</numerusform>
            <numerusform>%n jobs wait for an operator</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>Crew (%n present)</source>
        <translation>
            <numerusform>Crew (%n present)</numerusform>
            <numerusform>Crew (%n present)</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>Machines (%n)</source>
        <translation>
            <numerusform>Machines (%n)</numerusform>
            <numerusform>Machines (%n)</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>Waiting jobs (%n)</source>
        <translation>
            <numerusform>Waiting jobs (%n)</numerusform>
            <numerusform>Waiting jobs (%n)</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>%n job(s)</source>
        <translation>
            <numerusform>%n job</numerusform>
            <numerusform>%n jobs</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>%n machine(s)</source>
        <translation>
            <numerusform>%n machine</numerusform>
            <numerusform>%n machines</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>… and %n more</source>
        <translation>
            <numerusform>… and %n more</numerusform>
            <numerusform>… and %n more</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>Idle machines (%n)</source>
        <translation>
            <numerusform>Idle machines (%n)</numerusform>
            <numerusform>Idle machines (%n)</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>Not available (%n)</source>
        <translation>
            <numerusform>Not available (%n)</numerusform>
            <numerusform>Not available (%n)</numerusform>
        </translation>
    </message>
</context>
<context>
    <name>Sheet</name>
    <message numerus="yes">
        <source>%n machine(s)</source>
        <translation>
            <numerusform>%n machine</numerusform>
            <numerusform>%n machines</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>%n job(s)</source>
        <translation>
            <numerusform>%n job</numerusform>
            <numerusform>%n jobs</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>Waiting jobs (%n)</source>
        <translation>
            <numerusform>Waiting jobs (%n)</numerusform>
            <numerusform>Waiting jobs (%n)</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>Machines down (%n) - lockout/tagout before any work</source>
        <translation>
            <numerusform>Machines down (%n) - lockout/tagout before any work</numerusform>
            <numerusform>Machines down (%n) - lockout/tagout before any work</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>%n slot(s)</source>
        <translation>
            <numerusform>%n slot</numerusform>
            <numerusform>%n slots</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>%n job(s) can only run on {machines}</source>
        <translation>
            <numerusform>%n job can only run on {machines}</numerusform>
            <numerusform>%n jobs can only run on {machines}</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>so %n of them must wait</source>
        <translation>
            <numerusform>so %n of them must wait</numerusform>
            <numerusform>so %n of them must wait</numerusform>
        </translation>
    </message>
</context>
<context>
    <name>SheetPrinting</name>
    <message numerus="yes">
        <source>Wrote %n page(s) to {path}</source>
        <translation>
            <numerusform>Wrote %n page to {path}</numerusform>
            <numerusform>Wrote %n pages to {path}</numerusform>
        </translation>
    </message>
</context>
</TS>
