<?xml version="1.0" encoding="utf-8"?>
<!DOCTYPE TS>
<TS version="2.1" language="es_ES">
<context>
    <name>AlternativesTab</name>
    <message>
        <source>ranking plans failed: {error}</source>
        <translation>la clasificación de planes falló: {error}</translation>
    </message>
    <message>
        <source>Ranking cancelled</source>
        <translation>Clasificación cancelada</translation>
    </message>
    <message>
        <source>No plan yet</source>
        <translation>Todavía no hay plan</translation>
    </message>
    <message>
        <source>Alternatives are ranked for one dispatch round (Plan menu: One round)</source>
        <translation>Las alternativas se clasifican para una ronda de asignación (menú Plan: Una ronda)</translation>
    </message>
    <message>
        <source>Alternatives are ranked for the &apos;least total&apos; and &apos;most value&apos; objectives</source>
        <translation>Las alternativas se clasifican para los objetivos &apos;Menor total&apos; y &apos;Mayor valor&apos;</translation>
    </message>
    <message>
        <source>Ranking plans…</source>
        <translation>Clasificando planes…</translation>
    </message>
    <message>
        <source>Put plan #{rank} of the alternatives in force</source>
        <translation>Poner en vigor el plan n.º {rank} de las alternativas</translation>
    </message>
</context>
<context>
    <name>AlternativesView</name>
    <message>
        <source>The best plans to list, best first</source>
        <translation>Los mejores planes que listar, el mejor primero</translation>
    </message>
    <message>
        <source>How many plans</source>
        <translation>Cuántos planes</translation>
    </message>
    <message>
        <source>Find best plans</source>
        <translation>Buscar los mejores planes</translation>
    </message>
    <message>
        <source>Rank the best plans of the shop as it is now</source>
        <translation>Clasificar los mejores planes del taller tal como está ahora</translation>
    </message>
    <message>
        <source>Ranking status</source>
        <translation>Estado de la clasificación</translation>
    </message>
    <message>
        <source>How many plans were found, or why none</source>
        <translation>Cuántos planes se encontraron, o por qué ninguno</translation>
    </message>
    <message>
        <source>Ranked plans</source>
        <translation>Planes clasificados</translation>
    </message>
    <message>
        <source>The best plans, best first, with their gap to the best</source>
        <translation>Los mejores planes, el mejor primero, con su diferencia respecto al mejor</translation>
    </message>
    <message>
        <source>Plan details</source>
        <translation>Detalles del plan</translation>
    </message>
    <message>
        <source>The selected plan and what it changes against the best</source>
        <translation>El plan seleccionado y lo que cambia respecto al mejor</translation>
    </message>
    <message>
        <source>How man&amp;y plans:</source>
        <translation>&amp;Cuántos planes:</translation>
    </message>
    <message>
        <source>Find best pla&amp;ns</source>
        <translation>&amp;Buscar los mejores planes</translation>
    </message>
    <message>
        <source>Put this plan &amp;in force…</source>
        <translation>&amp;Poner este plan en vigor…</translation>
    </message>
    <message>
        <source>Put this plan in force</source>
        <translation>Poner este plan en vigor</translation>
    </message>
    <message>
        <source>Confirm and record the selected plan as the decision in force</source>
        <translation>Confirmar y registrar el plan seleccionado como la decisión vigente</translation>
    </message>
    <message>
        <source>No plan to rank</source>
        <translation>Ningún plan que clasificar</translation>
    </message>
    <message>
        <source>less value</source>
        <translation>menos valor</translation>
    </message>
    <message>
        <source>more</source>
        <translation>más</translation>
    </message>
    <message>
        <source>#{rank}  total {total} {unit}  (best)</source>
        <translation>n.º {rank}  total {total} {unit}  (el mejor)</translation>
    </message>
    <message>
        <source>#{rank}  total {total} {unit}  (+{gap} {more})</source>
        <translation>n.º {rank}  total {total} {unit}  (+{gap} {more})</translation>
    </message>
    <message>
        <source>Plan #{rank}: total {total} {unit}; the optimal plan</source>
        <translation>Plan n.º {rank}: total {total} {unit}; el plan óptimo</translation>
    </message>
    <message>
        <source>Plan #{rank}: total {total} {unit}; {gap} {more} than the best</source>
        <translation>Plan n.º {rank}: total {total} {unit}; {gap} {more} que el mejor</translation>
    </message>
    <message numerus="yes">
        <source>%n distinct plan(s) found near the best (machines that take several jobs repeat the same plan in other slots), best first</source>
        <translation>
            <numerusform>%n plan distinto encontrado cerca del mejor (las máquinas que aceptan varios trabajos repiten el mismo plan en otros puestos), el mejor primero</numerusform>
            <numerusform>%n planes distintos encontrados cerca del mejor (las máquinas que aceptan varios trabajos repiten el mismo plan en otros puestos), el mejor primero</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>%n best plan(s), best first</source>
        <translation>
            <numerusform>%n mejor plan, el mejor primero</numerusform>
            <numerusform>%n mejores planes, el mejor primero</numerusform>
        </translation>
    </message>
    <message>
        <source>Plan #{rank}: total {total}</source>
        <translation>Plan n.º {rank}: total {total}</translation>
    </message>
    <message>
        <source>Waiting: {jobs}</source>
        <translation>En espera: {jobs}</translation>
    </message>
    <message>
        <source>Against the best plan:</source>
        <translation>Respecto al mejor plan:</translation>
    </message>
</context>
<context>
    <name>Asking</name>
    <message>
        <source>Use this value</source>
        <translation>Usar este valor</translation>
    </message>
    <message>
        <source>Close without changing anything</source>
        <translation>Cerrar sin cambiar nada</translation>
    </message>
</context>
<context>
    <name>ChangeoverModel</name>
    <message>
        <source>the clipboard holds no text to paste</source>
        <translation>el portapapeles no contiene texto que pegar</translation>
    </message>
    <message>
        <source>pasted block: row {row}, column 1: {label} is not a family of this table</source>
        <translation>bloque pegado: fila {row}, columna 1: {label} no es una familia de esta tabla</translation>
    </message>
    <message>
        <source>pasted block: {rows} x {width} cells do not fit from the current cell: the table has {free_rows} rows and {free_columns} columns from there</source>
        <translation>bloque pegado: {rows} x {width} celdas no caben desde la celda actual: la tabla tiene desde ahí {free_rows} filas y {free_columns} columnas</translation>
    </message>
    <message>
        <source>pasted block: row {row}, column {column} (change from {a} to {b}): {problem}</source>
        <translation>bloque pegado: fila {row}, columna {column} (cambio de {a} a {b}): {problem}</translation>
    </message>
    <message>
        <source>nothing mounted</source>
        <translation>nada montado</translation>
    </message>
    <message>
        <source>Change from {a} to {b}: not allowed (a job of {b} cannot follow {a} on these machines); type a number to allow it</source>
        <translation>Cambio de {a} a {b}: no permitido (un trabajo de {b} no puede seguir a {a} en estas máquinas); escriba un número para permitirlo</translation>
    </message>
    <message>
        <source>No change: {b} stays mounted, {value} ({unit})</source>
        <translation>Sin cambio: {b} sigue montada, {value} ({unit})</translation>
    </message>
    <message>
        <source>Change from {a} to {b}: {value} ({unit}); empty: not allowed</source>
        <translation>Cambio de {a} a {b}: {value} ({unit}); vacío: no permitido</translation>
    </message>
    <message>
        <source>to {family}</source>
        <translation>a {family}</translation>
    </message>
    <message>
        <source>Changes to family {family}</source>
        <translation>Cambios a la familia {family}</translation>
    </message>
    <message>
        <source>from {family}</source>
        <translation>de {family}</translation>
    </message>
    <message>
        <source>Changes from family {family} (mounted now)</source>
        <translation>Cambios desde la familia {family} (montada ahora)</translation>
    </message>
    <message>
        <source>Changes from an empty or cleaned machine</source>
        <translation>Cambios desde una máquina vacía o limpia</translation>
    </message>
    <message>
        <source>{table}: change from {a} to {b}: {problem}</source>
        <translation>{table}: cambio de {a} a {b}: {problem}</translation>
    </message>
    <message>
        <source>not allowed</source>
        <translation>no permitido</translation>
    </message>
    <message>
        <source>Change from {a} to {b} = {value}</source>
        <translation>Cambio de {a} a {b} = {value}</translation>
    </message>
    <message>
        <source>this shop has no changeover table to paste into</source>
        <translation>este taller no tiene tabla de cambios donde pegar</translation>
    </message>
    <message numerus="yes">
        <source>Paste %n changeover(s)</source>
        <translation>
            <numerusform>Pegar %n cambio</numerusform>
            <numerusform>Pegar %n cambios</numerusform>
        </translation>
    </message>
</context>
<context>
    <name>ChangeoverTab</name>
    <message>
        <source>Changeover tables</source>
        <translation>Tablas de cambios</translation>
    </message>
    <message>
        <source>The time or cost of changing a group of machines from one setup family to another</source>
        <translation>El tiempo o coste de cambiar un grupo de máquinas de una familia de preparación a otra</translation>
    </message>
    <message>
        <source>Changeover table</source>
        <translation>Tabla de cambios</translation>
    </message>
    <message>
        <source>Which changeover table the grid below edits</source>
        <translation>Qué tabla de cambios edita la cuadrícula de abajo</translation>
    </message>
    <message>
        <source>&amp;Table:</source>
        <translation>&amp;Tabla:</translation>
    </message>
    <message>
        <source>Changeover grid</source>
        <translation>Cuadrícula de cambios</translation>
    </message>
    <message>
        <source>Rows: the family mounted now, last the nothing-mounted row; columns: the family changed to; an empty cell means the change is not allowed</source>
        <translation>Filas: la familia montada ahora, al final la fila de nada montado; columnas: la familia a la que se cambia; una celda vacía significa que el cambio no está permitido</translation>
    </message>
    <message>
        <source>This shop has no changeover table: every value is typed in the grid. Import one with dispatcher import-jobs --changeovers FILE.</source>
        <translation>Este taller no tiene tabla de cambios: cada valor se escribe en la cuadrícula. Importe una con dispatcher import-jobs --changeovers FILE.</translation>
    </message>
    <message>
        <source>Changes need not add up: a change through a wash-up can be cheaper than the direct one, and the plans never assume otherwise. Follow each machine&apos;s setup instructions.</source>
        <translation>Los cambios no tienen por qué sumarse: un cambio pasando por un lavado puede ser más barato que el directo, y los planes nunca suponen lo contrario. Siga las instrucciones de preparación de cada máquina.</translation>
    </message>
    <message>
        <source>Shared by: {machines}</source>
        <translation>Compartida por: {machines}</translation>
    </message>
    <message>
        <source>paste into the changeover table refused: {problem}; nothing changed</source>
        <translation>pegado en la tabla de cambios rechazado: {problem}; nada cambió</translation>
    </message>
    <message numerus="yes">
        <source>Pasted; %n changeover(s) changed</source>
        <translation>
            <numerusform>Pegado; %n cambio modificado</numerusform>
            <numerusform>Pegado; %n cambios modificados</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>Disallow %n changeover(s)</source>
        <translation>
            <numerusform>Prohibir %n cambio</numerusform>
            <numerusform>Prohibir %n cambios</numerusform>
        </translation>
    </message>
</context>
<context>
    <name>Clipboard</name>
    <message>
        <source>pasted block</source>
        <translation>bloque pegado</translation>
    </message>
    <message>
        <source>the clipboard holds no text to paste</source>
        <translation>el portapapeles no contiene texto que pegar</translation>
    </message>
    <message>
        <source>{source}: job(s) not in this shop: {jobs}</source>
        <translation>{source}: trabajo(s) que no están en este taller: {jobs}</translation>
    </message>
    <message>
        <source>{source}: {rows} x {width} cells do not fit from {job} / {machine}: the grid has {free_rows} rows and {free_columns} machine columns from there</source>
        <translation>{source}: {rows} x {width} celdas no caben desde {job} / {machine}: la cuadrícula tiene desde ahí {free_rows} filas y {free_columns} columnas de máquina</translation>
    </message>
    <message>
        <source>row {row}, column {column}: </source>
        <translation>fila {row}, columna {column}: </translation>
    </message>
    <message>
        <source>row {row}: </source>
        <translation>fila {row}: </translation>
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
        <translation>Operario</translation>
    </message>
    <message>
        <source>Present</source>
        <translation>Presente</translation>
    </message>
    <message>
        <source>Arrives</source>
        <translation>Llega</translation>
    </message>
    <message>
        <source>Leaves</source>
        <translation>Se va</translation>
    </message>
    <message>
        <source>Minds</source>
        <translation>Atiende</translation>
    </message>
    <message>
        <source>Notes</source>
        <translation>Notas</translation>
    </message>
    <message>
        <source>expired ({how})</source>
        <extracomment>Words read as &quot;authorised&quot; / &quot;not authorised&quot; when a block is pasted. An edit was refused (the message says why); nothing changed.</extracomment>
        <translation>caducada ({how})</translation>
    </message>
    <message>
        <source>own authorisation</source>
        <translation>autorización propia</translation>
    </message>
    <message>
        <source>through group {group}</source>
        <translation>a través del grupo {group}</translation>
    </message>
    <message>
        <source>{operator} (id {id}): {notes}</source>
        <translation>{operator} (id {id}): {notes}</translation>
    </message>
    <message>
        <source>{operator} (id {id})</source>
        <translation>{operator} (id {id})</translation>
    </message>
    <message>
        <source>present</source>
        <translation>presente</translation>
    </message>
    <message>
        <source>absent</source>
        <translation>ausente</translation>
    </message>
    <message>
        <source>Space or click: mark present or absent for this shift</source>
        <translation>Espacio o clic: marcar presente o ausente en este turno</translation>
    </message>
    <message>
        <source>from the shift&apos;s start</source>
        <translation>desde el inicio del turno</translation>
    </message>
    <message>
        <source>until the shift&apos;s end</source>
        <translation>hasta el final del turno</translation>
    </message>
    <message>
        <source>When {operator} arrives: HH:MM within the shift, empty for the shift&apos;s start (F2 or double-click to type)</source>
        <translation>Cuándo llega {operator}: HH:MM dentro del turno, vacío para el inicio del turno (F2 o doble clic para escribir)</translation>
    </message>
    <message>
        <source>When {operator} leaves: HH:MM within the shift, empty for the shift&apos;s end (F2 or double-click to type)</source>
        <translation>Cuándo se va {operator}: HH:MM dentro del turno, vacío para el final del turno (F2 o doble clic para escribir)</translation>
    </message>
    <message>
        <source>Notes on {operator} (F2 or double-click to edit)</source>
        <translation>Notas sobre {operator} (F2 o doble clic para editar)</translation>
    </message>
    <message>
        <source>How many machines {operator} runs at once (1 to {most})</source>
        <translation>Cuántas máquinas atiende {operator} a la vez (de 1 a {most})</translation>
    </message>
    <message>
        <source>expired</source>
        <translation>caducada</translation>
    </message>
    <message>
        <source>{mark} {days} d</source>
        <translation>{mark} {days} d</translation>
    </message>
    <message>
        <source>group</source>
        <translation>grupo</translation>
    </message>
    <message>
        <source>{operator} is not authorised for {machine} (Space or click: authorise)</source>
        <translation>{operator} no está autorizado para {machine} (Espacio o clic: autorizar)</translation>
    </message>
    <message>
        <source>{operator} for {machine}: {how}</source>
        <translation>{operator} para {machine}: {how}</translation>
    </message>
    <message numerus="yes">
        <source>, expired %n day(s) ago (counts as none)</source>
        <translation>
            <numerusform>, caducó hace %n día (no cuenta)</numerusform>
            <numerusform>, caducó hace %n días (no cuenta)</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>, expires in %n day(s)</source>
        <translation>
            <numerusform>, caduca en %n día</numerusform>
            <numerusform>, caduca en %n días</numerusform>
        </translation>
    </message>
    <message>
        <source>; the group&apos;s authorisation is given or withdrawn from the cell&apos;s menu</source>
        <translation>; la autorización del grupo se da o se retira desde el menú de la celda</translation>
    </message>
    <message>
        <source>{machine}: runs unattended (needs no operator)</source>
        <translation>{machine}: funciona sin atención (no necesita operario)</translation>
    </message>
    <message>
        <source>Machine groups: {groups}</source>
        <translation>Grupos de máquinas: {groups}</translation>
    </message>
    <message>
        <source>Right-click: runs unattended or needs an operator; machine groups</source>
        <translation>Clic derecho: funciona sin atención o necesita operario; grupos de máquinas</translation>
    </message>
    <message>
        <source>(unattended)</source>
        <translation>(sin atención)</translation>
    </message>
    <message>
        <source>renaming {operator} refused: {problem}; nothing changed</source>
        <translation>cambio de nombre de {operator} rechazado: {problem}; no ha cambiado nada</translation>
    </message>
    <message>
        <source>Rename {operator}</source>
        <translation>Renombrar a {operator}</translation>
    </message>
    <message>
        <source>time refused: {problem}; nothing changed</source>
        <translation>hora rechazada: {problem}; no ha cambiado nada</translation>
    </message>
    <message>
        <source>{operator} arrives at {time}</source>
        <translation>{operator} llega a las {time}</translation>
    </message>
    <message>
        <source>{operator} arrives at the shift&apos;s start</source>
        <translation>{operator} llega al inicio del turno</translation>
    </message>
    <message>
        <source>{operator} leaves at {time}</source>
        <translation>{operator} se va a las {time}</translation>
    </message>
    <message>
        <source>{operator} leaves at the shift&apos;s end</source>
        <translation>{operator} se va al final del turno</translation>
    </message>
    <message numerus="yes">
        <source>{operator} minds %n machine(s)</source>
        <translation>
            <numerusform>{operator} atiende %n máquina</numerusform>
            <numerusform>{operator} atiende %n máquinas</numerusform>
        </translation>
    </message>
    <message>
        <source>{operator} present</source>
        <translation>{operator} presente</translation>
    </message>
    <message>
        <source>{operator} absent</source>
        <translation>{operator} ausente</translation>
    </message>
    <message>
        <source>Authorise {operator} for {machine}</source>
        <translation>Autorizar a {operator} para {machine}</translation>
    </message>
    <message>
        <source>Withdraw {operator} for {machine}</source>
        <translation>Retirar la autorización de {operator} para {machine}</translation>
    </message>
    <message>
        <source>paste authorisations into the machine columns</source>
        <translation>pegue las autorizaciones en las columnas de máquinas</translation>
    </message>
    <message>
        <source>the pasted block (row {row}, column {column}) reaches past the last operator or machine</source>
        <translation>el bloque pegado (fila {row}, columna {column}) va más allá del último operario o máquina</translation>
    </message>
    <message>
        <source>pasted row {row}, column {column}: {cell} is neither yes (1, x, yes) nor no (0, empty, no)</source>
        <translation>fila pegada {row}, columna {column}: {cell} no es ni sí (1, x, sí) ni no (0, vacío, no)</translation>
    </message>
</context>
<context>
    <name>CrewTab</name>
    <message>
        <source>Operators run only machines they are trained and authorised for; the site&apos;s training records decide, this table only repeats them.</source>
        <translation>Los operarios solo manejan las máquinas para las que están formados y autorizados; deciden los registros de formación de la planta, esta tabla solo los repite.</translation>
    </message>
    <message>
        <source>Crew</source>
        <translation>Personal</translation>
    </message>
    <message>
        <source>Operators of this shift, who is present, and what each is authorised to run</source>
        <translation>Los operarios de este turno, quién está presente y qué puede manejar cada uno</translation>
    </message>
    <message>
        <source>Crew table</source>
        <translation>Tabla de personal</translation>
    </message>
    <message>
        <source>One row per operator: present, arrives, leaves, machines minded at once, notes, and a check for each machine they may run; F2 on a machine cell sets the expiry date, the context menu gives machine groups and removes an operator</source>
        <translation>Una fila por operario: presente, llega, se va, máquinas atendidas a la vez, notas y una marca por cada máquina que puede manejar; F2 en una celda de máquina fija la fecha de caducidad, el menú contextual da grupos de máquinas y quita un operario</translation>
    </message>
    <message>
        <source>This shop has no crew: plans do not staff machines. Add an operator to plan with who is here.</source>
        <translation>Este taller no tiene personal: los planes no asignan operarios a las máquinas. Añada un operario para planificar con quien está.</translation>
    </message>
    <message>
        <source>No crew</source>
        <translation>Sin personal</translation>
    </message>
    <message>
        <source>Add &amp;operator</source>
        <translation>&amp;Añadir operario</translation>
    </message>
    <message>
        <source>Add operator</source>
        <translation>Añadir operario</translation>
    </message>
    <message>
        <source>Add an operator to the crew (Ctrl+Z takes it back)</source>
        <translation>Añadir un operario al personal (Ctrl+Z lo deshace)</translation>
    </message>
    <message>
        <source>Remove opera&amp;tor</source>
        <translation>&amp;Quitar operario</translation>
    </message>
    <message>
        <source>Remove operator</source>
        <translation>Quitar operario</translation>
    </message>
    <message>
        <source>Remove the operator of the current row with their authorisations (Ctrl+Z puts them back)</source>
        <translation>Quitar el operario de la fila actual con sus autorizaciones (Ctrl+Z lo devuelve)</translation>
    </message>
    <message>
        <source>Machine gro&amp;ups…</source>
        <translation>&amp;Grupos de máquinas…</translation>
    </message>
    <message>
        <source>Machine groups</source>
        <translation>Grupos de máquinas</translation>
    </message>
    <message>
        <source>See, create, rename and delete machine groups and choose their machines</source>
        <translation>Ver, crear, renombrar y eliminar grupos de máquinas y elegir sus máquinas</translation>
    </message>
    <message>
        <source>Warn about authorisations expiring within</source>
        <translation>Avisar de autorizaciones que caducan en</translation>
    </message>
    <message>
        <source> days</source>
        <translation> días</translation>
    </message>
    <message>
        <source>Warning days</source>
        <translation>Días de aviso</translation>
    </message>
    <message>
        <source>Authorisations that run out within this many days of the shift&apos;s day are marked here and listed in the plan and on the sheet</source>
        <translation>Las autorizaciones que caducan en estos días desde el día del turno se marcan aquí y se listan en el plan y en la hoja</translation>
    </message>
    <message>
        <source>Safety caution</source>
        <translation>Advertencia de seguridad</translation>
    </message>
    <message>
        <source>{what} refused: {problem}; nothing changed</source>
        <translation>{what} rechazado: {problem}; no ha cambiado nada</translation>
    </message>
    <message>
        <source>Operator {operator}</source>
        <translation>Operario {operator}</translation>
    </message>
    <message>
        <source>&amp;Expiry date…</source>
        <translation>Fecha de &amp;caducidad…</translation>
    </message>
    <message>
        <source>&amp;Notes…</source>
        <translation>&amp;Notas…</translation>
    </message>
    <message>
        <source>Authorised for &amp;group</source>
        <translation>Autorizado para el gr&amp;upo</translation>
    </message>
    <message>
        <source>Authorised for group</source>
        <translation>Autorizado para el grupo</translation>
    </message>
    <message>
        <source>(no machine groups)</source>
        <translation>(sin grupos de máquinas)</translation>
    </message>
    <message>
        <source>Runs una&amp;ttended (needs no operator)</source>
        <translation>Funciona &amp;sin atención (no necesita operario)</translation>
    </message>
    <message>
        <source>Add Operator {n}</source>
        <translation>Añadir operario {n}</translation>
    </message>
    <message>
        <source>Remove {operator}</source>
        <translation>Quitar a {operator}</translation>
    </message>
    <message>
        <source>removing the operator</source>
        <translation>Quitar el operario</translation>
    </message>
    <message>
        <source>Notes</source>
        <translation>Notas</translation>
    </message>
    <message>
        <source>Notes on {operator}:</source>
        <translation>Notas sobre {operator}:</translation>
    </message>
    <message>
        <source>Free text kept with the operator (shown in the crew table&apos;s tooltip)</source>
        <translation>Texto libre guardado con el operario (se muestra en la información de la tabla de personal)</translation>
    </message>
    <message>
        <source>Notes on {operator}</source>
        <translation>Notas sobre {operator}</translation>
    </message>
    <message>
        <source>notes</source>
        <translation>Notas</translation>
    </message>
    <message>
        <source>group {group} (all its machines)</source>
        <translation>el grupo {group} (todas sus máquinas)</translation>
    </message>
    <message>
        <source>{operator} is not authorised for {machine}: authorise first (Space), then set the expiry date</source>
        <translation>{operator} no está autorizado para {machine}: autorice primero (Espacio) y luego fije la fecha de caducidad</translation>
    </message>
    <message>
        <source>Authorisation expiry</source>
        <translation>Caducidad de la autorización</translation>
    </message>
    <message>
        <source>{operator} for {what} expires on (YYYY-MM-DD; empty: never):</source>
        <translation>{operator} para {what} caduca el (AAAA-MM-DD; vacío: nunca):</translation>
    </message>
    <message>
        <source>The last day the authorisation counts; after it the operator is not planned on these machines</source>
        <translation>El último día en que cuenta la autorización; después el operario no se planifica en estas máquinas</translation>
    </message>
    <message>
        <source>{operator} for {what}: expires {date}</source>
        <translation>{operator} para {what}: caduca el {date}</translation>
    </message>
    <message>
        <source>{operator} for {what}: no expiry</source>
        <translation>{operator} para {what}: sin caducidad</translation>
    </message>
    <message>
        <source>expiry date</source>
        <translation>Fecha de caducidad</translation>
    </message>
    <message>
        <source>{machine} runs unattended</source>
        <translation>{machine} funciona sin atención</translation>
    </message>
    <message>
        <source>{machine} needs an operator</source>
        <translation>{machine} necesita operario</translation>
    </message>
    <message>
        <source>unattended machine</source>
        <translation>Máquina sin atención</translation>
    </message>
    <message>
        <source>Authorise {operator} for group {group}</source>
        <translation>Autorizar a {operator} para el grupo {group}</translation>
    </message>
    <message>
        <source>Withdraw {operator} from group {group}</source>
        <translation>Retirar a {operator} del grupo {group}</translation>
    </message>
    <message>
        <source>group authorisation</source>
        <translation>Autorización de grupo</translation>
    </message>
    <message numerus="yes">
        <source>Warn %n day(s) before an authorisation expires</source>
        <translation>
            <numerusform>Avisar %n día antes de que caduque una autorización</numerusform>
            <numerusform>Avisar %n días antes de que caduque una autorización</numerusform>
        </translation>
    </message>
    <message>
        <source>warning days</source>
        <translation>Días de aviso</translation>
    </message>
    <message>
        <source>Change machine groups</source>
        <translation>Cambiar grupos de máquinas</translation>
    </message>
    <message numerus="yes">
        <source>Withdraw %n authorisation(s)</source>
        <translation>
            <numerusform>Retirar %n autorización</numerusform>
            <numerusform>Retirar %n autorizaciones</numerusform>
        </translation>
    </message>
    <message>
        <source>paste into the crew refused: {problem}; nothing changed</source>
        <translation>pegado en el personal rechazado: {problem}; no ha cambiado nada</translation>
    </message>
    <message numerus="yes">
        <source>Paste %n authorisation(s)</source>
        <translation>
            <numerusform>Pegar %n autorización</numerusform>
            <numerusform>Pegar %n autorizaciones</numerusform>
        </translation>
    </message>
</context>
<context>
    <name>DecisionDialog</name>
    <message>
        <source>⚠ Safety first: before anyone works on this machine, apply lockout/tagout and follow the site&apos;s isolation procedure. Operators run only machines they are trained and authorised for. Follow each machine&apos;s setup instructions. Local regulations and the site&apos;s safety rules take precedence over this plan.</source>
        <translation>⚠ La seguridad primero: antes de que nadie trabaje en esta máquina, aplique bloqueo y etiquetado (LOTO) y siga el procedimiento de aislamiento de la planta. Los operarios solo manejan las máquinas para las que están formados y autorizados. Siga las instrucciones de preparación de cada máquina. La normativa local y las normas de seguridad de la planta prevalecen sobre este plan.</translation>
    </message>
    <message>
        <source>What happened (for example: hydraulic leak, waiting for fitter)</source>
        <translation>Qué ha pasado (por ejemplo: fuga hidráulica, esperando al mecánico)</translation>
    </message>
    <message>
        <source>What was done (for example: seal replaced, checked by maintenance)</source>
        <translation>Qué se ha hecho (por ejemplo: junta cambiada, revisada por mantenimiento)</translation>
    </message>
    <message>
        <source>Why it is urgent (for example: customer line stopped)</source>
        <translation>Por qué es urgente (por ejemplo: línea del cliente parada)</translation>
    </message>
    <message>
        <source>Why the job is pulled (for example: order cancelled, material not arrived)</source>
        <translation>Por qué se retira el trabajo (por ejemplo: pedido cancelado, material sin llegar)</translation>
    </message>
    <message>
        <source>Anything the next shift should know</source>
        <translation>Lo que debe saber el siguiente turno</translation>
    </message>
    <message>
        <source>Confirm re-dispatch - {title}</source>
        <translation>Confirmar reasignación - {title}</translation>
    </message>
    <message>
        <source>Event</source>
        <translation>Suceso</translation>
    </message>
    <message>
        <source>What happened, as the decision will record it</source>
        <translation>Qué ha pasado, tal como lo registrará la decisión</translation>
    </message>
    <message>
        <source>Safety reminder</source>
        <translation>Recordatorio de seguridad</translation>
    </message>
    <message>
        <source>Lockout/tagout and the site&apos;s rules come before the plan</source>
        <translation>El bloqueo y etiquetado (LOTO) y las normas de la planta van antes que el plan</translation>
    </message>
    <message>
        <source>{mark} No plan is possible after this event: {problem}</source>
        <translation>{mark} No hay plan posible tras este suceso: {problem}</translation>
    </message>
    <message>
        <source>{mark} &lt;b&gt;Not every rush job can be placed:&lt;/b&gt; {problem}</source>
        <translation>{mark} &lt;b&gt;No todos los trabajos urgentes se pueden asignar:&lt;/b&gt; {problem}</translation>
    </message>
    <message>
        <source>Re-dispatched from the plan in force; move penalties included: {value} {unit} (jobs dispatched but not started move only when the saving is larger).</source>
        <translation>Reasignado desde el plan vigente; penalizaciones por traslado incluidas: {value} {unit} (los trabajos asignados pero no empezados solo se trasladan si el ahorro es mayor).</translation>
    </message>
    <message>
        <source>The job is taken out of the shop document (Undo brings it back); earlier decisions in the history keep it.</source>
        <translation>El trabajo se quita del documento del taller (Deshacer lo recupera); las decisiones anteriores del historial lo conservan.</translation>
    </message>
    <message>
        <source>&lt;b&gt;Proposed changes against {plan}:&lt;/b&gt;</source>
        <translation>&lt;b&gt;Cambios propuestos, comparados con {plan}:&lt;/b&gt;</translation>
    </message>
    <message>
        <source>Proposed changes</source>
        <translation>Cambios propuestos</translation>
    </message>
    <message>
        <source>How the proposed plan differs from the plan in force</source>
        <translation>En qué se diferencia el plan propuesto del plan vigente</translation>
    </message>
    <message>
        <source>Reason</source>
        <translation>Motivo</translation>
    </message>
    <message>
        <source>The kind of reason recorded with the decision</source>
        <translation>El tipo de motivo que se registra con la decisión</translation>
    </message>
    <message>
        <source>&amp;Reason:</source>
        <translation>&amp;Motivo:</translation>
    </message>
    <message>
        <source>Note</source>
        <translation>Nota</translation>
    </message>
    <message>
        <source>&amp;Note:</source>
        <translation>&amp;Nota:</translation>
    </message>
    <message>
        <source>Supervisor name (required)</source>
        <translation>Nombre del supervisor (obligatorio)</translation>
    </message>
    <message>
        <source>Supervisor</source>
        <translation>Supervisor</translation>
    </message>
    <message>
        <source>Who takes the decision (required)</source>
        <translation>Quién toma la decisión (obligatorio)</translation>
    </message>
    <message>
        <source>&amp;Supervisor:</source>
        <translation>&amp;Supervisor:</translation>
    </message>
    <message>
        <source>Not recorded yet</source>
        <translation>Aún no registrada</translation>
    </message>
    <message>
        <source>Why the last confirmation was not recorded; confirming again retries</source>
        <translation>Por qué no se registró la última confirmación; confirmar de nuevo lo reintenta</translation>
    </message>
    <message>
        <source>Confirm and record</source>
        <translation>Confirmar y registrar</translation>
    </message>
    <message>
        <source>Record the decision in the history and put the plan in force</source>
        <translation>Registrar la decisión en el historial y poner el plan en vigor</translation>
    </message>
    <message>
        <source>Cancel</source>
        <translation>Cancelar</translation>
    </message>
    <message>
        <source>Close without recording; the plan in force stays</source>
        <translation>Cerrar sin registrar; el plan vigente se mantiene</translation>
    </message>
</context>
<context>
    <name>DecisionDiff</name>
    <message>
        <source>{machine} is down</source>
        <translation>{machine} está averiada</translation>
    </message>
    <message>
        <source>{machine} is back up</source>
        <translation>{machine} vuelve a estar en marcha</translation>
    </message>
    <message>
        <source>Rush job: {job}</source>
        <translation>Trabajo urgente: {job}</translation>
    </message>
    <message>
        <source>Job pulled: {job}</source>
        <translation>Trabajo retirado: {job}</translation>
    </message>
    <message>
        <source>Put the plan shown in force</source>
        <translation>Poner en vigor el plan mostrado</translation>
    </message>
    <message>
        <source>values</source>
        <translation>valores</translation>
    </message>
    <message>
        <source>costs</source>
        <translation>costes</translation>
    </message>
    <message>
        <source>setups</source>
        <translation>preparaciones</translation>
    </message>
    <message>
        <source>{planned_word} {before} → {after}, wait penalties {penalties_before} → {penalties_after}</source>
        <translation>{planned_word} {before} → {after}, penalizaciones por espera {penalties_before} → {penalties_after}</translation>
    </message>
    <message>
        <source>; move penalties {value} (apart)</source>
        <translation>; penalizaciones por traslado {value} (aparte)</translation>
    </message>
    <message>
        <source>No plan in force to compare with.</source>
        <translation>No hay plan vigente con el que comparar.</translation>
    </message>
    <message>
        <source>&lt;b&gt;pulled&lt;/b&gt;: {job} leaves the shop (frees {machine})</source>
        <translation>&lt;b&gt;retirado&lt;/b&gt;: {job} sale del taller (libera {machine})</translation>
    </message>
    <message>
        <source>&lt;b&gt;pulled&lt;/b&gt;: {job} leaves the shop</source>
        <translation>&lt;b&gt;retirado&lt;/b&gt;: {job} sale del taller</translation>
    </message>
    <message>
        <source>&lt;b&gt;moves&lt;/b&gt;: {job} from {machine} to {to_machine}</source>
        <translation>&lt;b&gt;se traslada&lt;/b&gt;: {job} de {machine} a {to_machine}</translation>
    </message>
    <message>
        <source>&lt;b&gt;starts&lt;/b&gt;: {job} on {machine}</source>
        <translation>&lt;b&gt;empieza&lt;/b&gt;: {job} en {machine}</translation>
    </message>
    <message>
        <source>&lt;b&gt;now waits&lt;/b&gt;: {job} (was on {machine})</source>
        <translation>&lt;b&gt;ahora espera&lt;/b&gt;: {job} (estaba en {machine})</translation>
    </message>
    <message>
        <source>&lt;b&gt;now waits&lt;/b&gt;: {job}</source>
        <translation>&lt;b&gt;ahora espera&lt;/b&gt;: {job}</translation>
    </message>
    <message>
        <source>&lt;b&gt;now idle&lt;/b&gt;: {machine}</source>
        <translation>&lt;b&gt;ahora libre&lt;/b&gt;: {machine}</translation>
    </message>
    <message>
        <source>&lt;b&gt;out of the plan&lt;/b&gt;: {machine}</source>
        <translation>&lt;b&gt;fuera del plan&lt;/b&gt;: {machine}</translation>
    </message>
    <message>
        <source>No job changes machine.</source>
        <translation>Ningún trabajo cambia de máquina.</translation>
    </message>
    <message>
        <source>Total: {before} → &lt;b&gt;{after}&lt;/b&gt; {unit} ({change})</source>
        <translation>Total: {before} → &lt;b&gt;{after}&lt;/b&gt; {unit} ({change})</translation>
    </message>
    <message>
        <source> - lower only because fewer jobs are dispatched: a waiting job adds just its wait penalty</source>
        <translation> - menor solo porque se asignan menos trabajos: un trabajo en espera suma solo su penalización por espera</translation>
    </message>
</context>
<context>
    <name>DecisionFlow</name>
    <message>
        <source>the plan in force (decision #{number})</source>
        <translation>el plan vigente (decisión n.º {number})</translation>
    </message>
    <message>
        <source>the plan shown (no decision recorded yet)</source>
        <translation>el plan mostrado (todavía sin decisión registrada)</translation>
    </message>
    <message>
        <source>choose a cell in a machine column first (or use the column&apos;s menu)</source>
        <translation>elija primero una celda en una columna de máquina (o use el menú de la columna)</translation>
    </message>
    <message>
        <source>{machine} is already down</source>
        <translation>{machine} ya está averiada</translation>
    </message>
    <message>
        <source>{machine} is already up</source>
        <translation>{machine} ya está en marcha</translation>
    </message>
    <message>
        <source>{job} is already a rush job</source>
        <translation>{job} ya es un trabajo urgente</translation>
    </message>
    <message>
        <source>{job} is running: only a waiting job can become a rush job</source>
        <translation>{job} está en marcha: solo un trabajo en espera puede pasar a urgente</translation>
    </message>
    <message>
        <source>{job} is done: only a waiting job can become a rush job</source>
        <translation>{job} está terminado: solo un trabajo en espera puede pasar a urgente</translation>
    </message>
    <message>
        <source>choose a cell in the job&apos;s row first (or use the row&apos;s menu)</source>
        <translation>elija primero una celda en la fila del trabajo (o use el menú de la fila)</translation>
    </message>
    <message>
        <source>{job} is already done; there is nothing to pull</source>
        <translation>{job} ya está terminado; no hay nada que retirar</translation>
    </message>
    <message>
        <source>Decision not recorded</source>
        <translation>Decisión no registrada</translation>
    </message>
    <message>
        <source>{error}

The plan in force is unchanged.</source>
        <translation>{error}

El plan vigente no cambia.</translation>
    </message>
    <message>
        <source>Not recorded: the history could not be written. Nothing was changed; press Confirm and record to try again.</source>
        <translation>No registrada: no se pudo escribir el historial. No se ha cambiado nada; confirme de nuevo para reintentarlo.</translation>
    </message>
    <message>
        <source>The plan in force and the open document are unchanged; the decision dialog stays open so that you can confirm again.</source>
        <translation>El plan vigente y el documento abierto no han cambiado; el diálogo de decisión sigue abierto para que pueda confirmar de nuevo.</translation>
    </message>
    <message>
        <source>{title} (decision #{number})</source>
        <translation>{title} (decisión n.º {number})</translation>
    </message>
    <message>
        <source>plan in force</source>
        <translation>plan vigente</translation>
    </message>
    <message>
        <source>decision #{number} ({title})</source>
        <translation>decisión n.º {number} ({title})</translation>
    </message>
    <message>
        <source>Decision #{number} recorded: {title}</source>
        <translation>Decisión n.º {number} registrada: {title}</translation>
    </message>
</context>
<context>
    <name>DecisionListModel</name>
    <message>
        <source>Time (local)</source>
        <extracomment>Column heads (English; the model shows them translated).</extracomment>
        <translation>Hora (local)</translation>
    </message>
    <message>
        <source>Shift</source>
        <translation>Turno</translation>
    </message>
    <message>
        <source>Supervisor</source>
        <translation>Supervisor</translation>
    </message>
    <message>
        <source>Reason</source>
        <translation>Motivo</translation>
    </message>
    <message>
        <source>Note</source>
        <translation>Nota</translation>
    </message>
    <message>
        <source>Total</source>
        <translation>Total</translation>
    </message>
    <message>
        <source>Proof</source>
        <translation>Prueba</translation>
    </message>
    <message>
        <source>✓ checked</source>
        <translation>✓ comprobado</translation>
    </message>
    <message>
        <source>Total of decision #{number} ({objective}); replaces #{replaces}</source>
        <translation>Total de la decisión n.º {number} ({objective}); sustituye a la n.º {replaces}</translation>
    </message>
    <message>
        <source>Decision #{number}, restored from #{restored}</source>
        <translation>Decisión n.º {number}, restaurada de la n.º {restored}</translation>
    </message>
    <message>
        <source>Decision #{number}</source>
        <translation>Decisión n.º {number}</translation>
    </message>
    <message>
        <source>Recorded at {time} UTC</source>
        <translation>Registrada el {time} UTC</translation>
    </message>
</context>
<context>
    <name>FileController</name>
    <message>
        <source>Opening {path}… (Esc cancels)</source>
        <translation>Abriendo {path}… (Esc cancela)</translation>
    </message>
    <message>
        <source>the new shop</source>
        <translation>el taller nuevo</translation>
    </message>
    <message>
        <source>{name} has changes that are not saved. Save them?</source>
        <translation>{name} tiene cambios sin guardar. ¿Guardarlos?</translation>
    </message>
    <message>
        <source>New shop</source>
        <translation>Taller nuevo</translation>
    </message>
    <message>
        <source>Opening {path}…</source>
        <translation>Abriendo {path}…</translation>
    </message>
    <message>
        <source>{path}: cannot be read ({error})</source>
        <translation>{path}: no se puede leer ({error})</translation>
    </message>
    <message>
        <source>Cannot open file</source>
        <translation>No se puede abrir el archivo</translation>
    </message>
    <message>
        <source>Not opened: {problem}</source>
        <translation>No abierto: {problem}</translation>
    </message>
    <message>
        <source>Not opened: reading {path} was cancelled</source>
        <translation>No abierto: se canceló la lectura de {path}</translation>
    </message>
    <message>
        <source>Opened {path}</source>
        <translation>Abierto {path}</translation>
    </message>
    <message>
        <source>Cannot save</source>
        <translation>No se puede guardar</translation>
    </message>
    <message>
        <source>Not saved: {problem}</source>
        <translation>No guardado: {problem}</translation>
    </message>
    <message>
        <source>Saved {path}</source>
        <translation>Guardado {path}</translation>
    </message>
    <message>
        <source>Cannot export</source>
        <translation>No se puede exportar</translation>
    </message>
    <message>
        <source>Exported the grid to {path}</source>
        <translation>Cuadrícula exportada a {path}</translation>
    </message>
    <message>
        <source>Exported the plan to {path}</source>
        <translation>Plan exportado a {path}</translation>
    </message>
    <message>
        <source>Cannot import</source>
        <translation>No se puede importar</translation>
    </message>
    <message>
        <source>Import {file}</source>
        <translation>Importar {file}</translation>
    </message>
    <message>
        <source>Grid imported</source>
        <translation>Cuadrícula importada</translation>
    </message>
    <message>
        <source>Imported {path}</source>
        <translation>Importado {path}</translation>
    </message>
    <message>
        <source>Recover unsaved work</source>
        <translation>Recuperar el trabajo sin guardar</translation>
    </message>
    <message>
        <source>The app did not close normally last time. Recover the unsaved copy saved at {time}?</source>
        <translation>La aplicación no se cerró con normalidad la última vez. ¿Recuperar la copia sin guardar del {time}?</translation>
    </message>
    <message>
        <source>Cannot recover</source>
        <translation>No se puede recuperar</translation>
    </message>
    <message>
        <source>Recovered unsaved work; save it under a name</source>
        <translation>Trabajo sin guardar recuperado; guárdelo con un nombre</translation>
    </message>
</context>
<context>
    <name>Format</name>
    <message>
        <source>shift start</source>
        <extracomment>Reason kinds (:data:`dispatcher.history.REASON_KINDS`) as shown; English, translated.</extracomment>
        <translation>inicio de turno</translation>
    </message>
    <message>
        <source>breakdown</source>
        <translation>avería</translation>
    </message>
    <message>
        <source>repair</source>
        <translation>reparación</translation>
    </message>
    <message>
        <source>rush job</source>
        <translation>trabajo urgente</translation>
    </message>
    <message>
        <source>manual change</source>
        <translation>cambio manual</translation>
    </message>
    <message>
        <source>restored</source>
        <translation>restaurado</translation>
    </message>
    <message>
        <source>other</source>
        <translation>otro</translation>
    </message>
    <message>
        <source>setup min</source>
        <translation>min de preparación</translation>
    </message>
    <message>
        <source>cost</source>
        <translation>coste</translation>
    </message>
    <message>
        <source>value</source>
        <translation>valor</translation>
    </message>
    <message>
        <source>{text} is not a number (type x or leave empty when the machine cannot run the job)</source>
        <translation>{text} no es un número (escriba x o déjelo vacío si la máquina no puede hacer el trabajo)</translation>
    </message>
    <message>
        <source>{text} is not a finite number</source>
        <translation>{text} no es un número finito</translation>
    </message>
    <message>
        <source>{value} is negative; values must be &gt;= 0</source>
        <translation>{value} es negativo; los valores deben ser &gt;= 0</translation>
    </message>
</context>
<context>
    <name>GridEdits</name>
    <message>
        <source>nothing typed over a changeover table in the selection</source>
        <translation>En la selección no hay nada escrito sobre una tabla de cambios</translation>
    </message>
    <message numerus="yes">
        <source>Use changeover table in %n cell(s)</source>
        <translation>
            <numerusform>Usar la tabla de cambios en %n celda</numerusform>
            <numerusform>Usar la tabla de cambios en %n celdas</numerusform>
        </translation>
    </message>
    <message>
        <source>choose a cell in a machine column first</source>
        <translation>elija primero una celda en una columna de máquina</translation>
    </message>
    <message>
        <source>Copied {rows} x {columns} cells</source>
        <translation>{rows} x {columns} celdas copiadas</translation>
    </message>
    <message>
        <source>nothing to paste into: the shop has no jobs or machines</source>
        <translation>no hay dónde pegar: el taller no tiene trabajos ni máquinas</translation>
    </message>
    <message numerus="yes">
        <source>Paste %n cell(s)</source>
        <translation>
            <numerusform>Pegar %n celda</numerusform>
            <numerusform>Pegar %n celdas</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>Pasted; %n cell(s) changed</source>
        <translation>
            <numerusform>Pegado; %n celda cambiada</numerusform>
            <numerusform>Pegado; %n celdas cambiadas</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>Mark %n cell(s) cannot run</source>
        <translation>
            <numerusform>Marcar %n celda como no puede</numerusform>
            <numerusform>Marcar %n celdas como no puede</numerusform>
        </translation>
    </message>
    <message>
        <source>Pin {job} to {machine}</source>
        <translation>Fijar {job} a {machine}</translation>
    </message>
    <message>
        <source>Forbid {job} on {machine}</source>
        <translation>Prohibir {job} en {machine}</translation>
    </message>
    <message>
        <source>Clear pin of {job} on {machine}</source>
        <translation>Quitar la fijación de {job} en {machine}</translation>
    </message>
    <message>
        <source>Add job</source>
        <translation>Añadir trabajo</translation>
    </message>
    <message>
        <source>Name of the new job (unique):</source>
        <translation>Nombre del trabajo nuevo (único):</translation>
    </message>
    <message>
        <source>A new row: the job cannot run anywhere until values are typed in</source>
        <translation>Una fila nueva: el trabajo no puede ir a ninguna máquina hasta que se escriban valores</translation>
    </message>
    <message>
        <source>job name {name} is empty or already used</source>
        <translation>el nombre de trabajo {name} está vacío o ya se usa</translation>
    </message>
    <message>
        <source>Add job {name}</source>
        <translation>Añadir el trabajo {name}</translation>
    </message>
    <message>
        <source>Added {name}: type its values; Ctrl+R if it is a rush job</source>
        <translation>{name} añadido: escriba sus valores; Ctrl+R si es un trabajo urgente</translation>
    </message>
    <message>
        <source>Add machine</source>
        <translation>Añadir máquina</translation>
    </message>
    <message>
        <source>Name of the new machine (unique):</source>
        <translation>Nombre de la máquina nueva (único):</translation>
    </message>
    <message>
        <source>A new column: no job can run on it until values are typed in</source>
        <translation>Una columna nueva: ningún trabajo puede ir a ella hasta que se escriban valores</translation>
    </message>
    <message>
        <source>machine name {name} is empty or already used</source>
        <translation>el nombre de máquina {name} está vacío o ya se usa</translation>
    </message>
    <message>
        <source>Add machine {name}</source>
        <translation>Añadir la máquina {name}</translation>
    </message>
    <message>
        <source>{job} done</source>
        <translation>{job} terminado</translation>
    </message>
    <message>
        <source>Wait penalty</source>
        <translation>Penalización por espera</translation>
    </message>
    <message>
        <source>Cost of leaving {job} waiting:</source>
        <translation>Coste de dejar esperando {job}:</translation>
    </message>
    <message>
        <source>Added to the plan&apos;s total when the job waits</source>
        <translation>Se suma al total del plan cuando el trabajo espera</translation>
    </message>
    <message>
        <source>Wait penalty of {job}</source>
        <translation>Penalización por espera de {job}</translation>
    </message>
    <message>
        <source>Slots</source>
        <translation>Puestos</translation>
    </message>
    <message>
        <source>Jobs {machine} takes per round:</source>
        <translation>Trabajos que acepta {machine} por ronda:</translation>
    </message>
    <message>
        <source>How many jobs the machine runs at once, 1 to 100</source>
        <translation>Cuántos trabajos lleva la máquina a la vez, de 1 a 100</translation>
    </message>
    <message numerus="yes">
        <source>{machine} takes %n job(s)</source>
        <translation>
            <numerusform>{machine} acepta %n trabajo</numerusform>
            <numerusform>{machine} acepta %n trabajos</numerusform>
        </translation>
    </message>
    <message>
        <source>{machine}: in maintenance</source>
        <translation>{machine}: en mantenimiento</translation>
    </message>
    <message>
        <source>{machine}: up</source>
        <translation>{machine}: en marcha</translation>
    </message>
    <message>
        <source>(nothing mounted)</source>
        <translation>(nada montado)</translation>
    </message>
    <message>
        <source>(any family)</source>
        <translation>(cualquier familia)</translation>
    </message>
    <message>
        <source>Mounted family</source>
        <translation>Familia montada</translation>
    </message>
    <message>
        <source>End family</source>
        <translation>Familia final</translation>
    </message>
    <message>
        <source>Family {machine} has mounted now:</source>
        <translation>Familia que {machine} tiene montada ahora:</translation>
    </message>
    <message>
        <source>Family {machine} must end the shift in:</source>
        <translation>Familia en la que {machine} debe terminar el turno:</translation>
    </message>
    <message>
        <source>A family of the machine&apos;s changeover table</source>
        <translation>Una familia de la tabla de cambios de la máquina</translation>
    </message>
    <message>
        <source>{machine}: the family name {problem}</source>
        <translation>{machine}: el nombre de familia {problem}</translation>
    </message>
    <message>
        <source>{machine}: family {family} is not in changeover table {table}</source>
        <translation>{machine}: la familia {family} no está en la tabla de cambios {table}</translation>
    </message>
    <message>
        <source>{machine} has no changeover table; add it to one first</source>
        <translation>{machine} no tiene tabla de cambios; asígnela primero a una</translation>
    </message>
    <message>
        <source>{machine} has {family} mounted</source>
        <translation>{machine} tiene {family} montada</translation>
    </message>
    <message>
        <source>{machine} ends the shift in {family}</source>
        <translation>{machine} termina el turno en {family}</translation>
    </message>
</context>
<context>
    <name>GridModel</name>
    <message>
        <source>Rush</source>
        <extracomment>Heads of the leading columns (English; the model shows them translated).</extracomment>
        <translation>Urgente</translation>
    </message>
    <message>
        <source>Wait penalty</source>
        <translation>Penalización por espera</translation>
    </message>
    <message>
        <source>Run hours</source>
        <translation>Horas de trabajo</translation>
    </message>
    <message>
        <source>Family</source>
        <translation>Familia</translation>
    </message>
    <message>
        <source>Plan puts it on</source>
        <translation>El plan lo pone en</translation>
    </message>
    <message>
        <source>up</source>
        <extracomment>The roles a heading answers (:meth:`GridModel.headerData`). The roles kept per cell (a role not listed, such as the tooltip, is computed when asked). At most this many cells are kept (a few pages of a big shop); the cache starts afresh. A machine&apos;s state in its column head, after its mark (English; shown translated).
----------
A machine&apos;s state in a sentence (English; shown translated).</extracomment>
        <translation>en marcha</translation>
    </message>
    <message>
        <source>DOWN</source>
        <translation>AVERIADA</translation>
    </message>
    <message>
        <source>maintenance</source>
        <translation>mantenimiento</translation>
    </message>
    <message>
        <source>down</source>
        <translation>averiada</translation>
    </message>
    <message>
        <source>in maintenance</source>
        <translation>en mantenimiento</translation>
    </message>
    <message>
        <source>{mark} RUSH</source>
        <translation>{mark} URGENTE</translation>
    </message>
    <message>
        <source>{job} is a rush job: the plan must place it this round</source>
        <translation>{job} es un trabajo urgente: el plan debe asignarlo en esta ronda</translation>
    </message>
    <message>
        <source>{job} may wait if the machines are needed elsewhere (tick to make it a rush job)</source>
        <translation>{job} puede esperar si las máquinas se necesitan en otro sitio (marque para hacerlo urgente)</translation>
    </message>
    <message>
        <source>Wait penalty of {job}: {value} ({unit}) added to the total if it is left waiting</source>
        <translation>Penalización por espera de {job}: {value} ({unit}) se suma al total si se deja esperando</translation>
    </message>
    <message>
        <source>Run hours of {job}: not given (needed only to fill the whole shift)</source>
        <translation>Horas de trabajo de {job}: sin indicar (solo hacen falta para llenar el turno completo)</translation>
    </message>
    <message>
        <source>Run hours of {job}: {hours} h (times each machine&apos;s speed factor; used when filling the whole shift)</source>
        <translation>Horas de trabajo de {job}: {hours} h (por el factor de velocidad de cada máquina; se usan al llenar el turno completo)</translation>
    </message>
    <message>
        <source>{job} names no setup family: its values are typed in the grid (type a family to price it by the changeover tables)</source>
        <translation>{job} no indica familia de preparación: sus valores se escriben en la cuadrícula (escriba una familia para valorarlo con las tablas de cambios)</translation>
    </message>
    <message>
        <source>{job} needs family {family}, which no changeover table lists: it waits unless values are typed</source>
        <translation>{job} necesita la familia {family}, que ninguna tabla de cambios incluye: espera salvo que se escriban valores</translation>
    </message>
    <message>
        <source>{job} needs family {family} (changeover tables: {tables})</source>
        <translation>{job} necesita la familia {family} (tablas de cambios: {tables})</translation>
    </message>
    <message>
        <source>▶ runs on {machine}</source>
        <translation>▶ en marcha en {machine}</translation>
    </message>
    <message>
        <source>{job} is already running on {machine}; it stays there</source>
        <translation>{job} ya está en marcha en {machine}; se queda allí</translation>
    </message>
    <message>
        <source>The plan puts {job} on {machine} (value {value} {unit})</source>
        <translation>El plan pone {job} en {machine} (valor {value} {unit})</translation>
    </message>
    <message>
        <source>done</source>
        <translation>terminado</translation>
    </message>
    <message>
        <source>{job} is done and takes no part</source>
        <translation>{job} está terminado y ya no participa</translation>
    </message>
    <message>
        <source>○ waits</source>
        <translation>○ espera</translation>
    </message>
    <message>
        <source>{job} waits this round: {reason}</source>
        <translation>{job} espera en esta ronda: {reason}</translation>
    </message>
    <message>
        <source>{job} waits this round</source>
        <translation>{job} espera en esta ronda</translation>
    </message>
    <message>
        <source>no plan yet</source>
        <translation>todavía no hay plan</translation>
    </message>
    <message>
        <source>nothing mounted</source>
        <translation>nada montado</translation>
    </message>
    <message>
        <source>Derived from changeover table {table}: change from {mounted} to {family}</source>
        <translation>Derivado de la tabla de cambios {table}: cambio de {mounted} a {family}</translation>
    </message>
    <message>
        <source>the table gives {value}</source>
        <translation>la tabla da {value}</translation>
    </message>
    <message>
        <source>the table does not allow this change</source>
        <translation>la tabla no permite este cambio</translation>
    </message>
    <message>
        <source>{mark} typed over changeover table {table} ({table_says}); Use changeover table puts the table&apos;s value back</source>
        <translation>{mark} escrito sobre la tabla de cambios {table} ({table_says}); Usar la tabla de cambios recupera el valor de la tabla</translation>
    </message>
    <message>
        <source>{machine} cannot run {job} (type a number to allow it)</source>
        <translation>{machine} no puede hacer {job} (escriba un número para permitirlo)</translation>
    </message>
    <message>
        <source>Value of {job} on {machine}: {value} ({unit})</source>
        <translation>Valor de {job} en {machine}: {value} ({unit})</translation>
    </message>
    <message>
        <source>{mark} the plan shown puts {job} here</source>
        <translation>{mark} el plan mostrado pone {job} aquí</translation>
    </message>
    <message>
        <source>{mark} {job} is already running here</source>
        <translation>{mark} {job} ya está en marcha aquí</translation>
    </message>
    <message>
        <source>{mark} pinned: {job} must go to {machine}</source>
        <translation>{mark} fijado: {job} debe ir a {machine}</translation>
    </message>
    <message>
        <source>{mark} forbidden: {job} must not go to {machine}</source>
        <translation>{mark} prohibido: {job} no debe ir a {machine}</translation>
    </message>
    <message>
        <source>{machine} is {state} and takes no jobs</source>
        <translation>{machine} está {state} y no acepta trabajos</translation>
    </message>
    <message>
        <source>Lockout/tagout before any work on {machine}</source>
        <translation>Bloqueo y etiquetado (LOTO) antes de cualquier trabajo en {machine}</translation>
    </message>
    <message>
        <source>Rush jobs must be placed this round</source>
        <translation>Los trabajos urgentes deben asignarse en esta ronda</translation>
    </message>
    <message>
        <source>Hours each job runs (to fill the whole shift)</source>
        <translation>Horas que dura cada trabajo (para llenar el turno completo)</translation>
    </message>
    <message>
        <source>Setup family each job needs (mould, die, colour group); prices its changeovers</source>
        <translation>Familia de preparación que necesita cada trabajo (molde, matriz, grupo de color); valora sus cambios</translation>
    </message>
    <message>
        <source>Added to the total ({unit}) when the job waits</source>
        <translation>Se suma al total ({unit}) cuando el trabajo espera</translation>
    </message>
    <message>
        <source>Where the plan shown puts each job</source>
        <translation>Dónde pone el plan mostrado cada trabajo</translation>
    </message>
    <message>
        <source>unattended</source>
        <translation>sin atención</translation>
    </message>
    <message numerus="yes">
        <source>{machine}: {state}, takes %n job(s) per round</source>
        <translation>
            <numerusform>{machine}: {state}, acepta %n trabajo por ronda</numerusform>
            <numerusform>{machine}: {state}, acepta %n trabajos por ronda</numerusform>
        </translation>
    </message>
    <message>
        <source>{mark} mounted now: {family}</source>
        <translation>{mark} montado ahora: {family}</translation>
    </message>
    <message>
        <source>nothing (cleaned)</source>
        <translation>nada (limpia)</translation>
    </message>
    <message>
        <source>{mark} must end the shift in: {family}</source>
        <translation>{mark} debe terminar el turno en: {family}</translation>
    </message>
    <message>
        <source>Changeover table: {table}</source>
        <translation>Tabla de cambios: {table}</translation>
    </message>
    <message>
        <source>No changeover table: values are typed</source>
        <translation>Sin tabla de cambios: los valores se escriben</translation>
    </message>
    <message>
        <source>Operator in the plan shown: {operator}</source>
        <translation>Operario en el plan mostrado: {operator}</translation>
    </message>
    <message>
        <source>Note: {note}</source>
        <translation>Nota: {note}</translation>
    </message>
    <message>
        <source>Right-click (or Shift+F10) for machine actions</source>
        <translation>Clic derecho (o Mayús+F10) para las acciones de la máquina</translation>
    </message>
    <message>
        <source>(done) {job}</source>
        <translation>(terminado) {job}</translation>
    </message>
    <message>
        <source>work order {work_order}</source>
        <translation>orden de trabajo {work_order}</translation>
    </message>
    <message>
        <source>due {time}</source>
        <translation>vence {time}</translation>
    </message>
    <message>
        <source>state: {state}</source>
        <translation>estado: {state}</translation>
    </message>
    <message>
        <source>waiting</source>
        <translation>en espera</translation>
    </message>
    <message>
        <source>running</source>
        <translation>en marcha</translation>
    </message>
    <message>
        <source>Mark {job} as rush</source>
        <translation>Marcar {job} como urgente</translation>
    </message>
    <message>
        <source>Unmark {job} as rush</source>
        <translation>Quitar urgencia a {job}</translation>
    </message>
    <message>
        <source>{job}: {problem}</source>
        <translation>{job}: {problem}</translation>
    </message>
    <message>
        <source>{job}: run hours must be a number &gt; 0 (or empty)</source>
        <translation>{job}: las horas de trabajo deben ser un número &gt; 0 (o vacías)</translation>
    </message>
    <message>
        <source>Run hours of {job} = {hours}</source>
        <translation>Horas de trabajo de {job} = {hours}</translation>
    </message>
    <message>
        <source>none</source>
        <translation>ninguna</translation>
    </message>
    <message>
        <source>{job}: the wait penalty must be a number &gt;= 0</source>
        <translation>{job}: la penalización por espera debe ser un número &gt;= 0</translation>
    </message>
    <message>
        <source>Wait penalty of {job} = {value}</source>
        <translation>Penalización por espera de {job} = {value}</translation>
    </message>
    <message>
        <source>cannot run</source>
        <translation>no puede</translation>
    </message>
    <message>
        <source>{job} on {machine} = {value}</source>
        <translation>{job} en {machine} = {value}</translation>
    </message>
    <message>
        <source>{job}: the family name {problem}</source>
        <translation>{job}: el nombre de familia {problem}</translation>
    </message>
    <message>
        <source>Family of {job} = {family}</source>
        <translation>Familia de {job} = {family}</translation>
    </message>
    <message>
        <source>Family of {job} cleared</source>
        <translation>Familia de {job} borrada</translation>
    </message>
</context>
<context>
    <name>GroupsDialog</name>
    <message>
        <source>Machine groups</source>
        <translation>Grupos de máquinas</translation>
    </message>
    <message>
        <source>Groups of machines an operator can be authorised for at once</source>
        <translation>Grupos de máquinas para los que se puede autorizar a un operario de una vez</translation>
    </message>
    <message>
        <source>Groups</source>
        <translation>Grupos</translation>
    </message>
    <message>
        <source>The machine groups of this shop; choose one to see and change its machines</source>
        <translation>Los grupos de máquinas de este taller; elija uno para ver y cambiar sus máquinas</translation>
    </message>
    <message>
        <source>Machines of the group</source>
        <translation>Máquinas del grupo</translation>
    </message>
    <message>
        <source>A check for each machine in the chosen group (Space toggles)</source>
        <translation>Una marca por cada máquina del grupo elegido (Espacio la cambia)</translation>
    </message>
    <message>
        <source>Group name</source>
        <translation>Nombre del grupo</translation>
    </message>
    <message>
        <source>The name for a new group, or the new name of the chosen group</source>
        <translation>El nombre de un grupo nuevo o el nuevo nombre del grupo elegido</translation>
    </message>
    <message>
        <source>&amp;New group</source>
        <translation>&amp;Nuevo grupo</translation>
    </message>
    <message>
        <source>New group</source>
        <translation>Nuevo grupo</translation>
    </message>
    <message>
        <source>Add a group with the name typed, without machines</source>
        <translation>Añadir un grupo con el nombre escrito, sin máquinas</translation>
    </message>
    <message>
        <source>&amp;Rename</source>
        <translation>&amp;Renombrar</translation>
    </message>
    <message>
        <source>Rename group</source>
        <translation>Renombrar grupo</translation>
    </message>
    <message>
        <source>Give the chosen group the name typed; its authorisations keep it</source>
        <translation>Dar al grupo elegido el nombre escrito; sus autorizaciones lo siguen</translation>
    </message>
    <message>
        <source>&amp;Delete</source>
        <translation>&amp;Eliminar</translation>
    </message>
    <message>
        <source>Delete group</source>
        <translation>Eliminar grupo</translation>
    </message>
    <message>
        <source>Delete the chosen group and the authorisations through it</source>
        <translation>Eliminar el grupo elegido y las autorizaciones a través de él</translation>
    </message>
    <message>
        <source>Problem</source>
        <translation>Problema</translation>
    </message>
    <message>
        <source>Use these groups (Ctrl+Z takes the change back)</source>
        <translation>Usar estos grupos (Ctrl+Z deshace el cambio)</translation>
    </message>
    <message>
        <source>Close without changing anything</source>
        <translation>Cerrar sin cambiar nada</translation>
    </message>
    <message>
        <source>Groups:</source>
        <translation>Grupos:</translation>
    </message>
    <message>
        <source>Machines in the group:</source>
        <translation>Máquinas del grupo:</translation>
    </message>
    <message>
        <source>refused: {problem}; nothing changed</source>
        <translation>rechazado: {problem}; no ha cambiado nada</translation>
    </message>
    <message>
        <source>a group named {name} exists already; nothing changed</source>
        <translation>ya existe un grupo llamado {name}; no ha cambiado nada</translation>
    </message>
    <message numerus="yes">
        <source>%n authorisation(s) through the deleted group go with it</source>
        <translation>
            <numerusform>%n autorización a través del grupo eliminado se va con él</numerusform>
            <numerusform>%n autorizaciones a través del grupo eliminado se van con él</numerusform>
        </translation>
    </message>
</context>
<context>
    <name>HistoryDock</name>
    <message>
        <source>History</source>
        <extracomment>While the dock is shown, how often it looks for decisions recorded by other stations. How long the listening thread waits for a notification before looking whether it should stop, and how long it waits after a fault before connecting again (seconds).</extracomment>
        <translation>Historial</translation>
    </message>
    <message>
        <source>The decisions recorded for this shop: filter, compare, restore</source>
        <translation>Las decisiones registradas para este taller: filtrar, comparar, restaurar</translation>
    </message>
    <message>
        <source>Show or hide the recorded decisions</source>
        <translation>Mostrar u ocultar las decisiones registradas</translation>
    </message>
    <message>
        <source>Restore decision</source>
        <translation>Restaurar decisión</translation>
    </message>
    <message>
        <source>Restore decision #{number}: supervisor name</source>
        <translation>Restaurar la decisión n.º {number}: nombre del supervisor</translation>
    </message>
    <message>
        <source>Who records the restored plan as a new decision</source>
        <translation>Quién registra el plan restaurado como una decisión nueva</translation>
    </message>
    <message>
        <source>Cannot restore</source>
        <translation>No se puede restaurar</translation>
    </message>
    <message>
        <source>Decision #{number} restored as #{new}</source>
        <translation>Decisión n.º {number} restaurada como n.º {new}</translation>
    </message>
</context>
<context>
    <name>HistoryPanel</name>
    <message>
        <source>Job</source>
        <translation>Trabajo</translation>
    </message>
    <message>
        <source>Machine</source>
        <translation>Máquina</translation>
    </message>
    <message>
        <source>Supervisor</source>
        <translation>Supervisor</translation>
    </message>
    <message>
        <source>Filter by</source>
        <translation>Filtrar por</translation>
    </message>
    <message>
        <source>Which name the filter text looks for</source>
        <translation>Qué nombre busca el texto del filtro</translation>
    </message>
    <message>
        <source>name to look for (exact), empty = all</source>
        <translation>nombre que buscar (exacto), vacío = todos</translation>
    </message>
    <message>
        <source>Filter text</source>
        <translation>Texto del filtro</translation>
    </message>
    <message>
        <source>any reason</source>
        <translation>cualquier motivo</translation>
    </message>
    <message>
        <source>Reason filter</source>
        <translation>Filtro por motivo</translation>
    </message>
    <message>
        <source>Show only decisions with this kind of reason</source>
        <translation>Mostrar solo las decisiones con este tipo de motivo</translation>
    </message>
    <message>
        <source>Refresh</source>
        <translation>&amp;Actualizar</translation>
    </message>
    <message>
        <source>Read the decisions again with these filters</source>
        <translation>Volver a leer las decisiones con estos filtros</translation>
    </message>
    <message>
        <source>Filter:</source>
        <translation>Filtro:</translation>
    </message>
    <message>
        <source>Recorded decisions</source>
        <translation>Decisiones registradas</translation>
    </message>
    <message>
        <source>Newest first; select one to see its plan, two to compare them</source>
        <translation>Las más recientes primero; seleccione una para ver su plan, dos para compararlas</translation>
    </message>
    <message>
        <source>Select one decision to see its plan, or two to compare them.</source>
        <translation>Seleccione una decisión para ver su plan, o dos para compararlas.</translation>
    </message>
    <message>
        <source>Decision details</source>
        <translation>Detalles de la decisión</translation>
    </message>
    <message>
        <source>The plan of the selected decision, or the changes between two</source>
        <translation>El plan de la decisión seleccionada, o los cambios entre dos</translation>
    </message>
    <message>
        <source>The history file these decisions come from (Edit ▸ Settings to change it)</source>
        <translation>El archivo de historial del que vienen estas decisiones (Editar ▸ Configuración para cambiarlo)</translation>
    </message>
    <message>
        <source>History file</source>
        <translation>Archivo de historial</translation>
    </message>
    <message>
        <source>&amp;Compare two</source>
        <translation>&amp;Comparar dos</translation>
    </message>
    <message>
        <source>Select two decisions (Ctrl+click) and compare their plans</source>
        <translation>Seleccione dos decisiones (Ctrl+clic) y compare sus planes</translation>
    </message>
    <message>
        <source>Compare two</source>
        <translation>Comparar dos</translation>
    </message>
    <message>
        <source>Re&amp;store…</source>
        <translation>Res&amp;taurar…</translation>
    </message>
    <message>
        <source>Record a new decision that puts this one&apos;s plan back in force</source>
        <translation>Registrar una nueva decisión que vuelva a poner en vigor el plan de esta</translation>
    </message>
    <message>
        <source>Restore</source>
        <translation>Restaurar</translation>
    </message>
    <message>
        <source>File: {path}</source>
        <translation>Archivo: {path}</translation>
    </message>
    <message>
        <source>Decision #{number} - {reason} by {supervisor}</source>
        <translation>Decisión n.º {number} - {reason}, por {supervisor}</translation>
    </message>
    <message>
        <source>Total: {total} ({objective})</source>
        <translation>Total: {total} ({objective})</translation>
    </message>
    <message>
        <source>▶ {machine}: {job} (running)</source>
        <translation>▶ {machine}: {job} (en marcha)</translation>
    </message>
    <message>
        <source>Waiting: {jobs}</source>
        <translation>En espera: {jobs}</translation>
    </message>
    <message>
        <source>Idle: {machines}</source>
        <translation>Libres: {machines}</translation>
    </message>
    <message>
        <source>Changes from #{number}:</source>
        <translation>Cambios respecto a la n.º {number}:</translation>
    </message>
    <message>
        <source>select exactly two decisions to compare</source>
        <translation>seleccione exactamente dos decisiones para comparar</translation>
    </message>
    <message>
        <source>From decision #{first} to #{second}:</source>
        <translation>De la decisión n.º {first} a la n.º {second}:</translation>
    </message>
    <message>
        <source>select one decision to restore</source>
        <translation>seleccione una decisión para restaurar</translation>
    </message>
</context>
<context>
    <name>JobImport</name>
    <message>
        <source>Import job list</source>
        <translation>Importar lista de trabajos</translation>
    </message>
    <message>
        <source>Job lists (*.csv *.tsv *.txt *.xlsx)</source>
        <translation>Listas de trabajos (*.csv *.tsv *.txt *.xlsx)</translation>
    </message>
    <message>
        <source>job list not imported: {problem}</source>
        <translation>lista de trabajos no importada: {problem}</translation>
    </message>
    <message>
        <source>job list not imported, nothing changed: {problem}</source>
        <translation>lista de trabajos no importada, nada cambió: {problem}</translation>
    </message>
    <message>
        <source>Import job list {file}</source>
        <translation>Importar la lista de trabajos {file}</translation>
    </message>
    <message numerus="yes">
        <source>Job list imported: %n job(s) added</source>
        <translation>
            <numerusform>Lista importada: %n trabajo añadido</numerusform>
            <numerusform>Lista importada: %n trabajos añadidos</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>%n updated</source>
        <translation>
            <numerusform>%n actualizado</numerusform>
            <numerusform>%n actualizados</numerusform>
        </translation>
    </message>
</context>
<context>
    <name>JobImportDialog</name>
    <message>
        <source>Import job list</source>
        <translation>Importar lista de trabajos</translation>
    </message>
    <message>
        <source>Which column of the file holds each field of a job</source>
        <translation>Qué columna del archivo contiene cada campo de un trabajo</translation>
    </message>
    <message numerus="yes">
        <source>{file}: %n job row(s). Choose the column that holds each field; jobs whose name is already in the shop are updated, the others added, waiting.</source>
        <translation>
            <numerusform>{file}: %n fila de trabajo. Elija la columna de cada campo; los trabajos cuyo nombre ya está en el taller se actualizan, los demás se añaden en espera.</numerusform>
            <numerusform>{file}: %n filas de trabajos. Elija la columna de cada campo; los trabajos cuyo nombre ya está en el taller se actualizan, los demás se añaden en espera.</numerusform>
        </translation>
    </message>
    <message>
        <source>Work order</source>
        <translation>Orden de trabajo</translation>
    </message>
    <message>
        <source>Job name</source>
        <translation>Nombre del trabajo</translation>
    </message>
    <message>
        <source>Setup family</source>
        <translation>Familia de preparación</translation>
    </message>
    <message>
        <source>Run hours</source>
        <translation>Horas de trabajo</translation>
    </message>
    <message>
        <source>Due</source>
        <translation>Vence</translation>
    </message>
    <message>
        <source>Rush (yes/no)</source>
        <translation>Urgente (sí/no)</translation>
    </message>
    <message>
        <source>Wait penalty</source>
        <translation>Penalización por espera</translation>
    </message>
    <message>
        <source>(not in the file)</source>
        <translation>(no está en el archivo)</translation>
    </message>
    <message>
        <source>column {n}</source>
        <translation>columna {n}</translation>
    </message>
    <message>
        <source>The column of the file holding {field}</source>
        <translation>La columna del archivo con {field}</translation>
    </message>
    <message>
        <source>&amp;Import</source>
        <translation>&amp;Importar</translation>
    </message>
</context>
<context>
    <name>MainWindow</name>
    <message>
        <source>Dispatch grid</source>
        <translation>Cuadrícula de asignación</translation>
    </message>
    <message>
        <source>Jobs as rows, machines as columns: each cell is the value of a job on a machine; Shift+F10 opens the actions of the current cell</source>
        <translation>Trabajos en filas, máquinas en columnas: cada celda es el valor de un trabajo en una máquina; Mayús+F10 abre las acciones de la celda actual</translation>
    </message>
    <message>
        <source>&amp;Grid</source>
        <translation>&amp;Cuadrícula</translation>
    </message>
    <message>
        <source>Plan</source>
        <translation>Plan</translation>
    </message>
    <message>
        <source>{planned} planned   {running} running   {pinned} pinned   {forbidden} forbidden   {cannot} cannot run   {down} machine down   {rush} rush</source>
        <translation>{planned} planificado   {running} en marcha   {pinned} fijado   {forbidden} prohibido   {cannot} no puede   {down} máquina averiada   {rush} urgente</translation>
    </message>
    <message>
        <source>{typed} typed over the changeover table   {mounted} mounted</source>
        <translation>{typed} escrito sobre la tabla de cambios   {mounted} montado</translation>
    </message>
    <message>
        <source>What the marks in the grid mean (colours repeat them)</source>
        <translation>Qué significan las marcas de la cuadrícula (los colores las repiten)</translation>
    </message>
    <message>
        <source>Legend of the grid&apos;s marks</source>
        <translation>Leyenda de las marcas de la cuadrícula</translation>
    </message>
    <message>
        <source>&amp;What-if map</source>
        <translation>&amp;Mapa qué pasaría si</translation>
    </message>
    <message>
        <source>&amp;Alternatives</source>
        <translation>A&amp;lternativas</translation>
    </message>
    <message>
        <source>C&amp;rew</source>
        <translation>&amp;Personal</translation>
    </message>
    <message>
        <source>C&amp;hangeovers</source>
        <translation>Cam&amp;bios</translation>
    </message>
    <message>
        <source>Time&amp;line</source>
        <translation>Cro&amp;nograma</translation>
    </message>
    <message>
        <source>Views</source>
        <translation>Vistas</translation>
    </message>
    <message>
        <source>Switch between the grid, the what-if map, the alternatives, the crew, the changeover tables and the timeline (Alt and the underlined letter)</source>
        <translation>Cambiar entre la cuadrícula, el mapa qué pasaría si, las alternativas, el personal, las tablas de cambios y el cronograma (Alt y la letra subrayada)</translation>
    </message>
    <message>
        <source>Jobs as rows, machines as columns: type setup values, pin or forbid pairs</source>
        <translation>Trabajos en filas, máquinas en columnas: escriba los valores de preparación, fije o prohíba pares</translation>
    </message>
    <message>
        <source>How much worse the plan gets if a job is forced onto a machine</source>
        <translation>Cuánto empeora el plan si un trabajo se fuerza a una máquina</translation>
    </message>
    <message>
        <source>The best few plans, best first, and what each changes</source>
        <translation>Los mejores planes, el mejor primero, y lo que cambia cada uno</translation>
    </message>
    <message>
        <source>Operators: present, how many machines each minds, what they are authorised to run</source>
        <translation>Operarios: presentes, cuántas máquinas atiende cada uno, qué están autorizados a manejar</translation>
    </message>
    <message>
        <source>Changeover tables: the setup between job families on each machine</source>
        <translation>Tablas de cambios: la preparación entre familias de trabajos en cada máquina</translation>
    </message>
    <message>
        <source>Each machine&apos;s jobs over the shift in run order, with their changeovers</source>
        <translation>Los trabajos de cada máquina a lo largo del turno en orden de ejecución, con sus cambios</translation>
    </message>
    <message>
        <source>Views of the shop</source>
        <translation>Vistas del taller</translation>
    </message>
    <message>
        <source>The grid, the what-if map, the alternatives, the crew, the changeover tables and the timeline</source>
        <translation>La cuadrícula, el mapa qué pasaría si, las alternativas, el personal, las tablas de cambios y el cronograma</translation>
    </message>
    <message>
        <source>The plan for the grid as it is now</source>
        <translation>El plan para la cuadrícula tal como está ahora</translation>
    </message>
    <message>
        <source>&amp;New</source>
        <translation>&amp;Nuevo</translation>
    </message>
    <message>
        <source>Start an empty shop</source>
        <translation>Empezar un taller vacío</translation>
    </message>
    <message>
        <source>&amp;Open…</source>
        <translation>&amp;Abrir…</translation>
    </message>
    <message>
        <source>Open a shop document or grid file</source>
        <translation>Abrir un documento de taller o un archivo de cuadrícula</translation>
    </message>
    <message>
        <source>&amp;Save</source>
        <translation>&amp;Guardar</translation>
    </message>
    <message>
        <source>Save the shop document</source>
        <translation>Guardar el documento del taller</translation>
    </message>
    <message>
        <source>Save &amp;As…</source>
        <translation>Guardar &amp;como…</translation>
    </message>
    <message>
        <source>Save under a new name</source>
        <translation>Guardar con un nombre nuevo</translation>
    </message>
    <message>
        <source>&amp;Import grid (CSV/XLSX)…</source>
        <translation>&amp;Importar cuadrícula (CSV/XLSX)…</translation>
    </message>
    <message>
        <source>Start a shop from a grid file</source>
        <translation>Empezar un taller a partir de un archivo de cuadrícula</translation>
    </message>
    <message>
        <source>&amp;Export grid (CSV/XLSX)…</source>
        <translation>&amp;Exportar cuadrícula (CSV/XLSX)…</translation>
    </message>
    <message>
        <source>Write the grid to a CSV or XLSX file</source>
        <translation>Escribir la cuadrícula en un archivo CSV o XLSX</translation>
    </message>
    <message>
        <source>Merge a grid file into this shop by job and machine names</source>
        <translation>Combinar un archivo de cuadrícula con este taller por nombres de trabajo y máquina</translation>
    </message>
    <message>
        <source>Import &amp;job list (CSV/XLSX)…</source>
        <translation>Importar lista de tra&amp;bajos (CSV/XLSX)…</translation>
    </message>
    <message>
        <source>Add or update jobs from a planning system&apos;s job list, choosing which column holds each field</source>
        <translation>Añadir o actualizar trabajos desde la lista de un sistema de planificación, eligiendo la columna de cada campo</translation>
    </message>
    <message>
        <source>Export p&amp;lan (CSV/XLSX)…</source>
        <translation>Exportar p&amp;lan (CSV/XLSX)…</translation>
    </message>
    <message>
        <source>Write the plan shown to a CSV or XLSX file</source>
        <translation>Escribir el plan mostrado en un archivo CSV o XLSX</translation>
    </message>
    <message>
        <source>&amp;Quit</source>
        <translation>&amp;Salir</translation>
    </message>
    <message>
        <source>Close the app</source>
        <translation>Cerrar la aplicación</translation>
    </message>
    <message>
        <source>&amp;Undo</source>
        <translation>&amp;Deshacer</translation>
    </message>
    <message>
        <source>&amp;Redo</source>
        <translation>&amp;Rehacer</translation>
    </message>
    <message>
        <source>&amp;Copy</source>
        <translation>&amp;Copiar</translation>
    </message>
    <message>
        <source>Copy the selected values</source>
        <translation>Copiar los valores seleccionados</translation>
    </message>
    <message>
        <source>Copy with &amp;names</source>
        <translation>Copiar con &amp;nombres</translation>
    </message>
    <message>
        <source>Copy the selection with job and machine names</source>
        <translation>Copiar la selección con los nombres de trabajos y máquinas</translation>
    </message>
    <message>
        <source>&amp;Paste</source>
        <translation>&amp;Pegar</translation>
    </message>
    <message>
        <source>Paste a tab-separated block from a spreadsheet</source>
        <translation>Pegar un bloque separado por tabuladores desde una hoja de cálculo</translation>
    </message>
    <message>
        <source>The machine cannot run the job (selected cells)</source>
        <translation>La máquina no puede hacer el trabajo (celdas seleccionadas)</translation>
    </message>
    <message>
        <source>The job must go to this machine</source>
        <translation>El trabajo debe ir a esta máquina</translation>
    </message>
    <message>
        <source>&amp;Forbid this pair</source>
        <translation>Pro&amp;hibir esta pareja</translation>
    </message>
    <message>
        <source>The job must not go to this machine</source>
        <translation>El trabajo no debe ir a esta máquina</translation>
    </message>
    <message>
        <source>C&amp;lear pin</source>
        <translation>&amp;Quitar fijación</translation>
    </message>
    <message>
        <source>Remove the pin or ban of this pair</source>
        <translation>Quitar la fijación o la prohibición de esta pareja</translation>
    </message>
    <message>
        <source>&amp;Rush job arrived…</source>
        <translation>Llegó un trabajo &amp;urgente…</translation>
    </message>
    <message>
        <source>Make the current job a rush job and re-dispatch</source>
        <translation>Convertir el trabajo actual en urgente y reasignar</translation>
    </message>
    <message>
        <source>Use changeover ta&amp;ble</source>
        <translation>Usar la ta&amp;bla de cambios</translation>
    </message>
    <message>
        <source>Drop the values typed in the selected cells: they follow the changeover table again</source>
        <translation>Descartar los valores escritos en las celdas seleccionadas: vuelven a seguir la tabla de cambios</translation>
    </message>
    <message>
        <source>Mounted &amp;family…</source>
        <translation>&amp;Familia montada…</translation>
    </message>
    <message>
        <source>Which setup family the current machine has mounted now</source>
        <translation>Qué familia de preparación tiene montada ahora la máquina actual</translation>
    </message>
    <message>
        <source>&amp;End family…</source>
        <translation>Familia fi&amp;nal…</translation>
    </message>
    <message>
        <source>Which family the current machine must end the shift in</source>
        <translation>En qué familia debe terminar el turno la máquina actual</translation>
    </message>
    <message>
        <source>&amp;Add job…</source>
        <translation>&amp;Añadir trabajo…</translation>
    </message>
    <message>
        <source>Add a job (for example a rush order that just arrived)</source>
        <translation>Añadir un trabajo (por ejemplo un pedido urgente que acaba de llegar)</translation>
    </message>
    <message>
        <source>Add &amp;machine…</source>
        <translation>Añadir &amp;máquina…</translation>
    </message>
    <message>
        <source>Add a machine column</source>
        <translation>Añadir una columna de máquina</translation>
    </message>
    <message>
        <source>Mark job &amp;done</source>
        <translation>Marcar trabajo como &amp;terminado</translation>
    </message>
    <message>
        <source>The current job is finished: it takes no part any more</source>
        <translation>El trabajo actual está terminado: ya no participa</translation>
    </message>
    <message>
        <source>Job &amp;pulled…</source>
        <translation>Trabajo &amp;retirado…</translation>
    </message>
    <message>
        <source>The current job is cancelled or put on hold: re-dispatch without it and take it out of the shop</source>
        <translation>El trabajo actual se cancela o se suspende: reasignar sin él y sacarlo del taller</translation>
    </message>
    <message>
        <source>Set &amp;wait penalty…</source>
        <translation>Fijar &amp;penalización por espera…</translation>
    </message>
    <message>
        <source>Cost of leaving the current job waiting</source>
        <translation>Coste de dejar esperando el trabajo actual</translation>
    </message>
    <message>
        <source>Machine &amp;down…</source>
        <translation>Máquina &amp;averiada…</translation>
    </message>
    <message>
        <source>Mark the current machine down and re-dispatch</source>
        <translation>Marcar la máquina actual como averiada y reasignar</translation>
    </message>
    <message>
        <source>Machine back &amp;up…</source>
        <translation>Máquina de nuevo en ma&amp;rcha…</translation>
    </message>
    <message>
        <source>Mark the current machine up again and re-dispatch</source>
        <translation>Marcar la máquina actual de nuevo en marcha y reasignar</translation>
    </message>
    <message>
        <source>The current machine takes no jobs (planned maintenance)</source>
        <translation>La máquina actual no acepta trabajos (mantenimiento planificado)</translation>
    </message>
    <message>
        <source>Set &amp;slots…</source>
        <translation>Fijar &amp;puestos…</translation>
    </message>
    <message>
        <source>How many jobs the current machine takes per round</source>
        <translation>Cuántos trabajos acepta la máquina actual por ronda</translation>
    </message>
    <message>
        <source>&amp;Put plan in force…</source>
        <translation>&amp;Poner el plan en vigor…</translation>
    </message>
    <message>
        <source>Record the plan shown as the decision in force</source>
        <translation>Registrar el plan mostrado como la decisión vigente</translation>
    </message>
    <message>
        <source>Import grid in&amp;to this shop…</source>
        <translation>Importar cuadrícula en es&amp;te taller…</translation>
    </message>
    <message>
        <source>Mar&amp;k cannot run</source>
        <translation>Marcar como no p&amp;uede</translation>
    </message>
    <message>
        <source>P&amp;in job to this machine</source>
        <translation>&amp;Fijar el trabajo a esta máquina</translation>
    </message>
    <message>
        <source>Machine in mai&amp;ntenance</source>
        <translation>Máquina en man&amp;tenimiento</translation>
    </message>
    <message>
        <source>Solve again</source>
        <translation>Calcular de nuevo</translation>
    </message>
    <message>
        <source>Re-s&amp;olve now</source>
        <translation>Recalcu&amp;lar ahora</translation>
    </message>
    <message>
        <source>&amp;Cancel solve</source>
        <translation>&amp;Cancelar cálculo</translation>
    </message>
    <message>
        <source>Stop waiting for a long solve</source>
        <translation>Dejar de esperar un cálculo largo</translation>
    </message>
    <message>
        <source>Least &amp;total</source>
        <translation>Menor &amp;total</translation>
    </message>
    <message>
        <source>Most &amp;value</source>
        <translation>Mayor &amp;valor</translation>
    </message>
    <message>
        <source>Smallest &amp;largest value</source>
        <translation>Menor valor &amp;máximo</translation>
    </message>
    <message>
        <source>Objective: {objective}</source>
        <translation>Objetivo: {objective}</translation>
    </message>
    <message>
        <source>One round: one job per free machine slot</source>
        <translation>Una ronda: un trabajo por puesto de máquina libre</translation>
    </message>
    <message>
        <source>Whole shift: several jobs per machine within its hours</source>
        <translation>Turno completo: varios trabajos por máquina dentro de sus horas</translation>
    </message>
    <message>
        <source>One &amp;round (one job per machine)</source>
        <translation>Una &amp;ronda (un trabajo por máquina)</translation>
    </message>
    <message>
        <source>Whole &amp;shift (several jobs per machine)</source>
        <translation>Tur&amp;no completo (varios trabajos por máquina)</translation>
    </message>
    <message>
        <source>Print pre&amp;view…</source>
        <translation>&amp;Vista previa de impresión…</translation>
    </message>
    <message>
        <source>See the dispatch sheet as it will print</source>
        <translation>Ver la hoja de asignación tal como se imprimirá</translation>
    </message>
    <message>
        <source>&amp;Print sheet…</source>
        <translation>Im&amp;primir hoja…</translation>
    </message>
    <message>
        <source>Print the dispatch sheet</source>
        <translation>Imprimir la hoja de asignación</translation>
    </message>
    <message>
        <source>Export sheet as P&amp;DF…</source>
        <translation>Exportar hoja como P&amp;DF…</translation>
    </message>
    <message>
        <source>Write the dispatch sheet to a PDF</source>
        <translation>Escribir la hoja de asignación en un PDF</translation>
    </message>
    <message>
        <source>Se&amp;ttings…</source>
        <translation>Confi&amp;guración…</translation>
    </message>
    <message>
        <source>History file, default supervisor name, autosave interval</source>
        <translation>Archivo de historial, nombre predeterminado del supervisor, intervalo de guardado automático</translation>
    </message>
    <message>
        <source>&amp;File</source>
        <translation>&amp;Archivo</translation>
    </message>
    <message>
        <source>Open &amp;recent</source>
        <translation>Abrir &amp;reciente</translation>
    </message>
    <message>
        <source>&amp;Edit</source>
        <translation>&amp;Editar</translation>
    </message>
    <message>
        <source>&amp;Job</source>
        <translation>&amp;Trabajo</translation>
    </message>
    <message>
        <source>&amp;Machine</source>
        <translation>&amp;Máquina</translation>
    </message>
    <message>
        <source>&amp;Plan</source>
        <translation>&amp;Plan</translation>
    </message>
    <message>
        <source>&amp;View</source>
        <translation>&amp;Ver</translation>
    </message>
    <message>
        <source>Untitled</source>
        <translation>Sin título</translation>
    </message>
    <message>
        <source>Plan in force: {what}. Any edit re-solves from scratch.</source>
        <translation>Plan vigente: {what}. Cualquier cambio recalcula desde cero.</translation>
    </message>
    <message>
        <source>internal error while solving: {error}</source>
        <translation>error interno durante el cálculo: {error}</translation>
    </message>
    <message>
        <source>Solving failed: {error}</source>
        <translation>El cálculo falló: {error}</translation>
    </message>
    <message>
        <source>Shop documents (*{suffix});;Grid files ({grids});;All files (*)</source>
        <translation>Documentos de taller (*{suffix});;Archivos de cuadrícula ({grids});;Todos los archivos (*)</translation>
    </message>
    <message>
        <source>Grid files ({grids})</source>
        <translation>Archivos de cuadrícula ({grids})</translation>
    </message>
    <message>
        <source>Open</source>
        <translation>Abrir</translation>
    </message>
    <message>
        <source>Import grid</source>
        <translation>Importar cuadrícula</translation>
    </message>
    <message>
        <source>Save shop</source>
        <translation>Guardar taller</translation>
    </message>
    <message>
        <source>Shop documents (*{suffix})</source>
        <translation>Documentos de taller (*{suffix})</translation>
    </message>
    <message>
        <source>Export grid</source>
        <translation>Exportar cuadrícula</translation>
    </message>
    <message>
        <source>Import grid into this shop</source>
        <translation>Importar cuadrícula en este taller</translation>
    </message>
    <message>
        <source>there is no plan to export yet</source>
        <translation>todavía no hay ningún plan que exportar</translation>
    </message>
    <message>
        <source>Export plan</source>
        <translation>Exportar plan</translation>
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
        <translation>Cambios sin guardar</translation>
    </message>
</context>
<context>
    <name>PlanPanel</name>
    <message>
        <source>Least total (setup + wait penalties)</source>
        <extracomment>Waiting jobs listed one by one in the panel; the rest are counted (the grid shows all).</extracomment>
        <translation>Menor total (preparación + penalizaciones por espera)</translation>
    </message>
    <message>
        <source>Most total value (values are gains)</source>
        <translation>Mayor valor total (los valores son ganancias)</translation>
    </message>
    <message>
        <source>Smallest largest single value, then least total</source>
        <translation>Menor valor individual máximo, luego menor total</translation>
    </message>
    <message>
        <source>One round: one job per free machine slot</source>
        <translation>Una ronda: un trabajo por puesto de máquina libre</translation>
    </message>
    <message>
        <source>Whole shift: several jobs per machine within its hours</source>
        <translation>Turno completo: varios trabajos por máquina dentro de sus horas</translation>
    </message>
    <message>
        <source>What the plan optimises; changing it re-solves at once</source>
        <translation>Lo que optimiza el plan; al cambiarlo se recalcula enseguida</translation>
    </message>
    <message>
        <source>Objective</source>
        <translation>Objetivo</translation>
    </message>
    <message>
        <source>Plan one dispatch round, or fill each machine&apos;s whole shift (needs run hours; may take longer, with progress and cancel)</source>
        <translation>Planificar una ronda de asignación o llenar el turno completo de cada máquina (necesita horas de trabajo; puede tardar más, con progreso y cancelación)</translation>
    </message>
    <message>
        <source>Planning mode</source>
        <translation>Modo de planificación</translation>
    </message>
    <message>
        <source>O&amp;bjective:</source>
        <translation>&amp;Objetivo:</translation>
    </message>
    <message>
        <source>Mo&amp;de:</source>
        <translation>&amp;Modo:</translation>
    </message>
    <message>
        <source>Plan total</source>
        <translation>Total del plan</translation>
    </message>
    <message>
        <source>The plan&apos;s total and what it is made of</source>
        <translation>El total del plan y de qué se compone</translation>
    </message>
    <message>
        <source>Total:</source>
        <translation>Total:</translation>
    </message>
    <message>
        <source>Jobs placed</source>
        <translation>Trabajos asignados</translation>
    </message>
    <message>
        <source>Jobs dispatched, running and waiting</source>
        <translation>Trabajos asignados, en marcha y en espera</translation>
    </message>
    <message>
        <source>Placed:</source>
        <translation>Asignados:</translation>
    </message>
    <message>
        <source>Proof of optimality</source>
        <translation>Prueba de optimalidad</translation>
    </message>
    <message>
        <source>Whether the plan is proven the best</source>
        <translation>Si está demostrado que el plan es el mejor</translation>
    </message>
    <message>
        <source>Proof:</source>
        <translation>Prueba:</translation>
    </message>
    <message>
        <source>No plan yet</source>
        <translation>Todavía no hay plan</translation>
    </message>
    <message>
        <source>Plan status</source>
        <translation>Estado del plan</translation>
    </message>
    <message>
        <source>Whether the plan shown is up to date, and why not</source>
        <translation>Si el plan mostrado está al día, y por qué no</translation>
    </message>
    <message>
        <source>Solving in the background; the grid stays editable</source>
        <translation>Calculando en segundo plano; la cuadrícula sigue editable</translation>
    </message>
    <message>
        <source>Solving</source>
        <translation>Cálculo</translation>
    </message>
    <message>
        <source>Cancel</source>
        <translation>Cancelar</translation>
    </message>
    <message>
        <source>Stop waiting for this solve (Esc)</source>
        <translation>Dejar de esperar este cálculo (Esc)</translation>
    </message>
    <message>
        <source>Cancel solve</source>
        <translation>Cancelar cálculo</translation>
    </message>
    <message>
        <source>Machine</source>
        <translation>Máquina</translation>
    </message>
    <message>
        <source>Job / why it waits</source>
        <translation>Trabajo / por qué espera</translation>
    </message>
    <message>
        <source>Value</source>
        <translation>Valor</translation>
    </message>
    <message>
        <source>Plan by machine</source>
        <translation>Plan por máquina</translation>
    </message>
    <message>
        <source>Each machine&apos;s jobs, the waiting jobs with their reasons, the crew and idle machines</source>
        <translation>Los trabajos de cada máquina, los trabajos en espera con sus motivos, el personal y las máquinas libres</translation>
    </message>
    <message>
        <source>Solving… {progress}</source>
        <translation>Calculando… {progress}</translation>
    </message>
    <message>
        <source>Solving…</source>
        <translation>Calculando…</translation>
    </message>
    <message>
        <source>… (hover for all)</source>
        <translation>… (pase el ratón para ver todo)</translation>
    </message>
    <message>
        <source>{mark} No plan: {why}</source>
        <translation>{mark} Sin plan: {why}</translation>
    </message>
    <message>
        <source>Solve cancelled; the plan shown is out of date (edit or F5 to re-solve)</source>
        <translation>Cálculo cancelado; el plan mostrado está desfasado (edite o pulse F5 para recalcular)</translation>
    </message>
    <message>
        <source>runs {job} with no qualified operator present</source>
        <translation>hace {job} sin ningún operario cualificado presente</translation>
    </message>
    <message>
        <source>Stop it only by the site&apos;s procedure: the plan never stops a running machine</source>
        <translation>Deténgala solo según el procedimiento de la planta: el plan nunca detiene una máquina en marcha</translation>
    </message>
    <message>
        <source>{mark} short of operators</source>
        <translation>{mark} faltan operarios</translation>
    </message>
    <message numerus="yes">
        <source>%n job(s) wait for an operator</source>
        <translation>
            <numerusform>%n trabajo espera a un operario</numerusform>
            <numerusform>%n trabajos esperan a un operario</numerusform>
        </translation>
    </message>
    <message>
        <source>authorisation ends {date}</source>
        <translation>la autorización termina el {date}</translation>
    </message>
    <message>
        <source>not here yet</source>
        <translation>todavía no ha llegado</translation>
    </message>
    <message>
        <source>{operator} arrives later in the shift</source>
        <translation>{operator} llega más tarde en el turno</translation>
    </message>
    <message>
        <source>absent</source>
        <translation>ausente</translation>
    </message>
    <message>
        <source>{operator} is absent this shift</source>
        <translation>{operator} está ausente este turno</translation>
    </message>
    <message numerus="yes">
        <source>Crew (%n present)</source>
        <translation>
            <numerusform>Personal (%n presente)</numerusform>
            <numerusform>Personal (%n presentes)</numerusform>
        </translation>
    </message>
    <message>
        <source>every machine in the plan is staffed</source>
        <translation>todas las máquinas del plan tienen operario</translation>
    </message>
    <message>
        <source>{mark} Up to date (solved in {ms} ms)</source>
        <translation>{mark} Al día (calculado en {ms} ms)</translation>
    </message>
    <message>
        <source>The plan shown matches the grid as it is now</source>
        <translation>El plan mostrado corresponde a la cuadrícula tal como está ahora</translation>
    </message>
    <message>
        <source>Sum of the values of newly dispatched jobs minus the wait penalties of waiting jobs (running jobs are not counted)</source>
        <translation>Suma de los valores de los trabajos recién asignados menos las penalizaciones de los trabajos en espera (los trabajos en marcha no cuentan)</translation>
    </message>
    <message>
        <source>Sum of the values of newly dispatched jobs plus the wait penalties of waiting jobs (running jobs are not counted)</source>
        <translation>Suma de los valores de los trabajos recién asignados más las penalizaciones de los trabajos en espera (los trabajos en marcha no cuentan)</translation>
    </message>
    <message>
        <source>{dispatched} dispatched, {running} running, {waiting} waiting</source>
        <translation>asignados: {dispatched}, en marcha: {running}, en espera: {waiting}</translation>
    </message>
    <message>
        <source>Jobs newly dispatched this round, jobs already running, jobs waiting</source>
        <translation>Trabajos recién asignados en esta ronda, trabajos ya en marcha, trabajos en espera</translation>
    </message>
    <message>
        <source>{mark} optimal (proven by the MILP solver)</source>
        <translation>{mark} óptimo (demostrado por el solver MILP)</translation>
    </message>
    <message>
        <source>{mark} optimal (certificate checked)</source>
        <translation>{mark} óptimo (certificado comprobado)</translation>
    </message>
    <message>
        <source>Dual potentials prove no other plan placing as many jobs has a better total</source>
        <translation>Los potenciales duales demuestran que ningún otro plan que asigne tantos trabajos tiene un total mejor</translation>
    </message>
    <message>
        <source>{mark} certificate did NOT check</source>
        <translation>{mark} el certificado NO se confirmó</translation>
    </message>
    <message>
        <source>; largest value {value}</source>
        <translation>; valor máximo {value}</translation>
    </message>
    <message>
        <source>unattended</source>
        <translation>sin atención</translation>
    </message>
    <message numerus="yes">
        <source>Machines (%n)</source>
        <translation>
            <numerusform>Máquinas (%n)</numerusform>
            <numerusform>Máquinas (%n)</numerusform>
        </translation>
    </message>
    <message>
        <source>{used} of {hours} h used</source>
        <translation>{used} de {hours} h usadas</translation>
    </message>
    <message>
        <source>Run hours planned on {machine} this shift, of the hours it has</source>
        <translation>Horas de trabajo planificadas en {machine} este turno, de las horas que tiene</translation>
    </message>
    <message>
        <source>Position {n} in {machine}&apos;s run order</source>
        <translation>Posición {n} en el orden de trabajo de {machine}</translation>
    </message>
    <message>
        <source>{machine} is minded by {operator} in this plan</source>
        <translation>{machine} la atiende {operator} en este plan</translation>
    </message>
    <message>
        <source>Value of {job} on {machine} ({unit}) - already running, not counted in the total</source>
        <translation>Valor de {job} en {machine} ({unit}) - ya en marcha, no cuenta en el total</translation>
    </message>
    <message>
        <source>Value of {job} on {machine} ({unit})</source>
        <translation>Valor de {job} en {machine} ({unit})</translation>
    </message>
    <message>
        <source>already running, stays</source>
        <translation>ya en marcha, se queda</translation>
    </message>
    <message>
        <source>newly dispatched</source>
        <translation>recién asignado</translation>
    </message>
    <message numerus="yes">
        <source>Waiting jobs (%n)</source>
        <translation>
            <numerusform>Trabajos en espera (%n)</numerusform>
            <numerusform>Trabajos en espera (%n)</numerusform>
        </translation>
    </message>
    <message>
        <source>{jobs} for {machines}</source>
        <translation>{jobs} para {machines}</translation>
    </message>
    <message numerus="yes">
        <source>%n job(s)</source>
        <translation>
            <numerusform>%n trabajo</numerusform>
            <numerusform>%n trabajos</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>%n machine(s)</source>
        <translation>
            <numerusform>%n máquina</numerusform>
            <numerusform>%n máquinas</numerusform>
        </translation>
    </message>
    <message>
        <source>no available machine can run it</source>
        <translation>ninguna máquina disponible puede hacerlo</translation>
    </message>
    <message>
        <source>cheaper to leave it waiting</source>
        <translation>es más barato dejarlo esperar</translation>
    </message>
    <message>
        <source>left waiting: cheaper overall</source>
        <translation>queda en espera: más barato en total</translation>
    </message>
    <message numerus="yes">
        <source>… and %n more</source>
        <translation>
            <numerusform>… y %n más</numerusform>
            <numerusform>… y %n más</numerusform>
        </translation>
    </message>
    <message>
        <source>see the grid&apos;s &apos;Plan puts it on&apos; column</source>
        <translation>vea la columna &apos;El plan lo pone en&apos; de la cuadrícula</translation>
    </message>
    <message>
        <source>Long lists are cut here to keep the window quick; every job&apos;s place or reason is in the grid</source>
        <translation>Las listas largas se cortan aquí para que la ventana siga ágil; el puesto o el motivo de cada trabajo está en la cuadrícula</translation>
    </message>
    <message numerus="yes">
        <source>Idle machines (%n)</source>
        <translation>
            <numerusform>Máquinas libres (%n)</numerusform>
            <numerusform>Máquinas libres (%n)</numerusform>
        </translation>
    </message>
    <message>
        <source>no job this round</source>
        <translation>ningún trabajo en esta ronda</translation>
    </message>
    <message numerus="yes">
        <source>Not available (%n)</source>
        <translation>
            <numerusform>No disponibles (%n)</numerusform>
            <numerusform>No disponibles (%n)</numerusform>
        </translation>
    </message>
    <message>
        <source>down or in maintenance - lockout/tagout before any work</source>
        <translation>averiada o en mantenimiento - bloqueo y etiquetado (LOTO) antes de cualquier trabajo</translation>
    </message>
    <message>
        <source>values</source>
        <translation>valores</translation>
    </message>
    <message>
        <source>costs</source>
        <translation>costes</translation>
    </message>
    <message>
        <source>setups</source>
        <translation>preparaciones</translation>
    </message>
    <message>
        <source> ({planned_word} {planned} - wait penalties {penalties})</source>
        <translation> ({planned_word} {planned} - penalizaciones por espera {penalties})</translation>
    </message>
    <message>
        <source> ({planned_word} {planned} + wait penalties {penalties})</source>
        <translation> ({planned_word} {planned} + penalizaciones por espera {penalties})</translation>
    </message>
</context>
<context>
    <name>SettingsController</name>
    <message>
        <source>Settings not changed</source>
        <translation>Configuración sin cambios</translation>
    </message>
    <message>
        <source>Choose a history file.</source>
        <translation>Elija un archivo de historial.</translation>
    </message>
    <message>
        <source>History file not changed</source>
        <translation>Archivo de historial sin cambios</translation>
    </message>
    <message>
        <source>{error}

Decisions are still recorded in {path}.</source>
        <translation>{error}

Las decisiones se siguen registrando en {path}.</translation>
    </message>
    <message>
        <source>Decisions are now recorded in {path}</source>
        <translation>Las decisiones se registran ahora en {path}</translation>
    </message>
    <message>
        <source>The new language applies at the next start</source>
        <translation>El nuevo idioma se aplica en el próximo inicio</translation>
    </message>
</context>
<context>
    <name>SettingsDialog</name>
    <message>
        <source>History file: choose an existing one or name a new one</source>
        <translation>Archivo de historial: elija uno existente o dé nombre a uno nuevo</translation>
    </message>
    <message>
        <source>Decision histories (*.sqlite);;All files (*)</source>
        <translation>Historiales de decisiones (*.sqlite);;Todos los archivos (*)</translation>
    </message>
    <message>
        <source>{path}: is a folder, not a history file</source>
        <translation>{path}: es una carpeta, no un archivo de historial</translation>
    </message>
    <message>
        <source>{path}: the file is read-only, so no decision could be recorded in it; it was left as it is. Make it writable or choose another file</source>
        <translation>{path}: el archivo es de solo lectura, así que no se podría registrar ninguna decisión en él; se ha dejado como estaba. Hágalo escribible o elija otro archivo</translation>
    </message>
    <message>
        <source>{path}: the folder {folder} does not exist</source>
        <translation>{path}: la carpeta {folder} no existe</translation>
    </message>
    <message>
        <source>{path}: the folder {folder} is not writable, so the history cannot be created there</source>
        <translation>{path}: la carpeta {folder} no es escribible, así que el historial no se puede crear allí</translation>
    </message>
    <message>
        <source>Settings</source>
        <translation>Configuración</translation>
    </message>
    <message>
        <source>The file every confirmed decision is recorded in</source>
        <translation>El archivo en el que se registra cada decisión confirmada</translation>
    </message>
    <message>
        <source>History file</source>
        <translation>Archivo de historial</translation>
    </message>
    <message>
        <source>&amp;Choose…</source>
        <translation>&amp;Elegir…</translation>
    </message>
    <message>
        <source>Pick an existing history file, or name a new one</source>
        <translation>Elegir un archivo de historial existente o dar nombre a uno nuevo</translation>
    </message>
    <message>
        <source>Choose history file</source>
        <translation>Elegir archivo de historial</translation>
    </message>
    <message>
        <source>Use &amp;default</source>
        <translation>Usar el &amp;predeterminado</translation>
    </message>
    <message>
        <source>The per-user file: {path}</source>
        <translation>El archivo de cada usuario: {path}</translation>
    </message>
    <message>
        <source>Use the default history file</source>
        <translation>Usar el archivo de historial predeterminado</translation>
    </message>
    <message>
        <source>&amp;History file:</source>
        <translation>Archivo de &amp;historial:</translation>
    </message>
    <message>
        <source>Confirmed decisions are recorded in this file. Another file takes effect at once: the history panel then lists its decisions. A new name starts an empty history; nothing is copied or deleted.</source>
        <translation>Las decisiones confirmadas se registran en este archivo. Otro archivo tiene efecto enseguida: el historial muestra entonces sus decisiones. Un nombre nuevo empieza un historial vacío; no se copia ni se borra nada.</translation>
    </message>
    <message>
        <source>About the history file</source>
        <translation>Sobre el archivo de historial</translation>
    </message>
    <message>
        <source>Several stations share one history on a PostgreSQL server: enter postgresql://host/database or service=NAME instead of a file (the password comes from the password or service file, never from here).</source>
        <translation>Varias estaciones comparten un historial en un servidor PostgreSQL: introduzca postgresql://host/base_de_datos o service=NOMBRE en lugar de un archivo (la contraseña se toma del archivo de contraseñas o de servicios, nunca de aquí).</translation>
    </message>
    <message>
        <source>About a shared history</source>
        <translation>Acerca de un historial compartido</translation>
    </message>
    <message>
        <source>PostgreSQL driver</source>
        <translation>Controlador de PostgreSQL</translation>
    </message>
    <message>
        <source>Says when the chosen PostgreSQL history cannot be used because its driver is not installed</source>
        <translation>Indica cuándo el historial PostgreSQL elegido no se puede usar porque su controlador no está instalado</translation>
    </message>
    <message>
        <source>for example: A. Supervisor</source>
        <translation>por ejemplo: A. Supervisor</translation>
    </message>
    <message>
        <source>Filled in when you confirm a decision (you can change it there)</source>
        <translation>Se rellena al confirmar una decisión (allí puede cambiarlo)</translation>
    </message>
    <message>
        <source>Default supervisor</source>
        <translation>Supervisor predeterminado</translation>
    </message>
    <message>
        <source>Default &amp;supervisor:</source>
        <translation>&amp;Supervisor predeterminado:</translation>
    </message>
    <message>
        <source>empty: {host}</source>
        <translation>vacío: {host}</translation>
    </message>
    <message>
        <source>Recorded with every decision made here, so other stations see where it was decided; empty records {host}</source>
        <translation>Se registra con cada decisión tomada aquí, para que otras estaciones vean dónde se decidió; vacío registra {host}</translation>
    </message>
    <message>
        <source>Station label</source>
        <translation>Nombre de la estación</translation>
    </message>
    <message>
        <source>The name of this station recorded with every decision; empty records the host name</source>
        <translation>El nombre de esta estación que se registra con cada decisión; vacío registra el nombre del equipo</translation>
    </message>
    <message>
        <source>Station &amp;label:</source>
        <translation>&amp;Nombre de la estación:</translation>
    </message>
    <message>
        <source> min</source>
        <translation> min</translation>
    </message>
    <message>
        <source>How often unsaved changes are copied to the recovery folder</source>
        <translation>Con qué frecuencia se copian los cambios sin guardar en la carpeta de recuperación</translation>
    </message>
    <message>
        <source>Autosave interval</source>
        <translation>Intervalo de guardado automático</translation>
    </message>
    <message>
        <source>&amp;Autosave every:</source>
        <translation>Guardado &amp;automático cada:</translation>
    </message>
    <message>
        <source>System language</source>
        <translation>Idioma del sistema</translation>
    </message>
    <message>
        <source>The interface and printed sheet language; applies at the next start</source>
        <translation>El idioma de la interfaz y de la hoja impresa; se aplica en el próximo inicio</translation>
    </message>
    <message>
        <source>Language</source>
        <translation>Idioma</translation>
    </message>
    <message>
        <source>&amp;Language:</source>
        <translation>&amp;Idioma:</translation>
    </message>
    <message>
        <source>Apply settings</source>
        <translation>Aplicar la configuración</translation>
    </message>
    <message>
        <source>Use these settings; a refused history file keeps the dialog open</source>
        <translation>Usar esta configuración; si se rechaza el archivo de historial, el diálogo sigue abierto</translation>
    </message>
    <message>
        <source>Cancel</source>
        <translation>Cancelar</translation>
    </message>
    <message>
        <source>Close without changing anything</source>
        <translation>Cerrar sin cambiar nada</translation>
    </message>
    <message>
        <source>Cannot be used here: {problem}</source>
        <translation>No se puede usar aquí: {problem}</translation>
    </message>
</context>
<context>
    <name>Sheet</name>
    <message>
        <source>no available machine can run it</source>
        <extracomment>How a waiting reason starts when no machine can take the job (shop.translate&apos;s words).</extracomment>
        <translation>ninguna máquina disponible puede hacerlo</translation>
    </message>
    <message>
        <source>(unnamed shop)</source>
        <extracomment>Printed for a shop without a name.</extracomment>
        <translation>(taller sin nombre)</translation>
    </message>
    <message>
        <source>Value</source>
        <translation>Valor</translation>
    </message>
    <message>
        <source>Cost</source>
        <translation>Coste</translation>
    </message>
    <message>
        <source>Setup</source>
        <translation>Prepara­ción</translation>
    </message>
    <message>
        <source>least total cost</source>
        <translation>menor coste total</translation>
    </message>
    <message>
        <source>smallest largest cost, then least total</source>
        <translation>menor coste máximo, luego menor total</translation>
    </message>
    <message>
        <source>least total setup</source>
        <translation>menor tiempo de preparación total</translation>
    </message>
    <message>
        <source>smallest largest setup, then least total</source>
        <translation>menor preparación máxima, luego menor total</translation>
    </message>
    <message>
        <source>greatest total value</source>
        <translation>mayor valor total</translation>
    </message>
    <message>
        <source>proven optimal</source>
        <translation>óptimo demostrado</translation>
    </message>
    <message>
        <source>optimal, proven by its certificate</source>
        <translation>óptimo, demostrado por su certificado</translation>
    </message>
    <message>
        <source>not placed in this round</source>
        <translation>no asignado en esta ronda</translation>
    </message>
    <message>
        <source>Apply lockout/tagout before any work on a machine that is down.</source>
        <extracomment>The cautions printed at the foot of every page. Wording is ours; the points are the ones every sheet must carry (see the Safety section of the README).</extracomment>
        <translation>Aplique bloqueo y etiquetado (LOTO) antes de cualquier trabajo en una máquina averiada.</translation>
    </message>
    <message>
        <source>Only operators trained and authorised for a machine may run it, whatever this sheet says.</source>
        <translation>Solo los operarios formados y autorizados para una máquina pueden manejarla, diga lo que diga esta hoja.</translation>
    </message>
    <message>
        <source>Follow the machine&apos;s own setup instructions for every changeover.</source>
        <translation>Siga las instrucciones de preparación de la propia máquina en cada cambio de formato.</translation>
    </message>
    <message>
        <source>Site safety rules and local regulations take precedence over this sheet.</source>
        <translation>Las normas de seguridad de la planta y la normativa local prevalecen sobre esta hoja.</translation>
    </message>
    <message>
        <source>Up</source>
        <extracomment>Machine states as printed. Words, never colour, carry the meaning.</extracomment>
        <translation>En marcha</translation>
    </message>
    <message>
        <source>DOWN</source>
        <translation>AVERIADA</translation>
    </message>
    <message>
        <source>MAINTENANCE</source>
        <translation>MANTENIMIENTO</translation>
    </message>
    <message>
        <source>Up</source>
        <comment>state column</comment>
        <extracomment>Paper names accepted by ``--paper`` and :func:`write_pdf`. Territories where US Letter is the usual office paper (common practice: the Americas that follow the US paper series, and the Philippines); everywhere else uses ISO A4. Page margins in millimetres (inside most printers&apos; unprintable border). Rules and padding of the body tables, in Qt text-layout pixels (see _layout_px_per_pt); ``{rule}`` and ``{tall}`` are filled in for the device.</extracomment>
        <translation>En marcha</translation>
    </message>
    <message>
        <source>DOWN</source>
        <comment>state column</comment>
        <translation>AVER.</translation>
    </message>
    <message>
        <source>MAINT.</source>
        <comment>state column</comment>
        <translation>MANT.</translation>
    </message>
    <message>
        <source>Machines and jobs ({machines}, {jobs})</source>
        <translation>Máquinas y trabajos ({machines}, {jobs})</translation>
    </message>
    <message numerus="yes">
        <source>%n machine(s)</source>
        <translation>
            <numerusform>%n máquina</numerusform>
            <numerusform>%n máquinas</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>%n job(s)</source>
        <translation>
            <numerusform>%n trabajo</numerusform>
            <numerusform>%n trabajos</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>Waiting jobs (%n)</source>
        <translation>
            <numerusform>Trabajos en espera (%n)</numerusform>
            <numerusform>Trabajos en espera (%n)</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>Machines down (%n) - lockout/tagout before any work</source>
        <translation>
            <numerusform>Máquinas averiadas (%n) - bloqueo y etiquetado antes de cualquier trabajo</numerusform>
            <numerusform>Máquinas averiadas (%n) - bloqueo y etiquetado antes de cualquier trabajo</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>%n slot(s)</source>
        <translation>
            <numerusform>%n puesto</numerusform>
            <numerusform>%n puestos</numerusform>
        </translation>
    </message>
    <message>
        <source>{machines} ({down} down, {idle} idle)</source>
        <translation>{machines} ({down} averiadas, {idle} libres)</translation>
    </message>
    <message numerus="yes">
        <source>%n job(s) can only run on {machines}</source>
        <translation>
            <numerusform>%n trabajo solo puede hacerse en {machines}</numerusform>
            <numerusform>%n trabajos solo pueden hacerse en {machines}</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <source>so %n of them must wait</source>
        <translation>
            <numerusform>así que %n de ellos debe esperar</numerusform>
            <numerusform>así que %n de ellos deben esperar</numerusform>
        </translation>
    </message>
    <message>
        <source>Machine</source>
        <extracomment>Main table columns: (key, width in percent of the text width); headings in _heading.</extracomment>
        <translation>Máquina</translation>
    </message>
    <message>
        <source>State</source>
        <translation>Estado</translation>
    </message>
    <message>
        <source>Seq.</source>
        <translation>N.º</translation>
    </message>
    <message>
        <source>Work order</source>
        <translation>Orden de trabajo</translation>
    </message>
    <message>
        <source>Job</source>
        <translation>Trabajo</translation>
    </message>
    <message>
        <source>Notes</source>
        <translation>Notas</translation>
    </message>
    <message>
        <source>Initials</source>
        <translation>Ini­ciales</translation>
    </message>
    <message>
        <source>Start</source>
        <translation>Inicio</translation>
    </message>
    <message>
        <source>Finish</source>
        <translation>Fin</translation>
    </message>
    <message>
        <source>Operator</source>
        <translation>Operario</translation>
    </message>
    <message>
        <source>RUSH</source>
        <translation>URGENTE</translation>
    </message>
    <message>
        <source>carries on</source>
        <translation>continúa</translation>
    </message>
    <message>
        <source>running since {time}</source>
        <translation>en marcha desde {time}</translation>
    </message>
    <message>
        <source>run {hours}</source>
        <translation>duración {hours}</translation>
    </message>
    <message>
        <source>h</source>
        <translation>h</translation>
    </message>
    <message>
        <source>pinned here</source>
        <translation>fijado aquí</translation>
    </message>
    <message>
        <source>no work: see Machines down</source>
        <extracomment>The same with the operator of each machine beside the initials box (shops with a crew).</extracomment>
        <translation>sin trabajo: véase Máquinas averiadas</translation>
    </message>
    <message>
        <source>idle: no job this round</source>
        <translation>libre: ningún trabajo en esta ronda</translation>
    </message>
    <message>
        <source>{k} of {count}</source>
        <translation>{k} de {count}</translation>
    </message>
    <message>
        <source>No machines in this shop.</source>
        <translation>Este taller no tiene máquinas.</translation>
    </message>
    <message>
        <source>Every running machine has a present, authorised operator.</source>
        <translation>Cada máquina en marcha tiene un operario presente y autorizado.</translation>
    </message>
    <message>
        <source>Crew</source>
        <translation>Personal</translation>
    </message>
    <message>
        <source>Why it waits</source>
        <translation>Por qué espera</translation>
    </message>
    <message>
        <source>same reason as {job}</source>
        <translation>mismo motivo que {job}</translation>
    </message>
    <message>
        <source>No job waits.</source>
        <translation>Ningún trabajo espera.</translation>
    </message>
    <message>
        <source>Since</source>
        <translation>Desde</translation>
    </message>
    <message>
        <source>Note</source>
        <translation>Nota</translation>
    </message>
    <message>
        <source>No machine is down.</source>
        <translation>Ninguna máquina está averiada.</translation>
    </message>
    <message>
        <source>Plan total</source>
        <translation>Total del plan</translation>
    </message>
    <message>
        <source>Machines</source>
        <translation>Máquinas</translation>
    </message>
    <message>
        <source>Jobs dispatched</source>
        <translation>Trabajos asignados</translation>
    </message>
    <message>
        <source>Jobs already running (carry on)</source>
        <translation>Trabajos ya en marcha (continúan)</translation>
    </message>
    <message>
        <source>Jobs waiting</source>
        <translation>Trabajos en espera</translation>
    </message>
    <message>
        <source>Plan status</source>
        <translation>Estado del plan</translation>
    </message>
    <message>
        <source>Totals</source>
        <translation>Totales</translation>
    </message>
    <message>
        <source>Supervisor</source>
        <translation>Supervisor</translation>
    </message>
    <message>
        <source>Signature</source>
        <translation>Firma</translation>
    </message>
    <message>
        <source>Time</source>
        <translation>Hora</translation>
    </message>
    <message>
        <source>Sign-off</source>
        <translation>Visto bueno</translation>
    </message>
    <message>
        <source>About this shop: {note}</source>
        <translation>Sobre este taller: {note}</translation>
    </message>
    <message>
        <source>Dispatch sheet - {shop}</source>
        <translation>Hoja de asignación - {shop}</translation>
    </message>
    <message>
        <source>Decision #{number} of {time}</source>
        <translation>Decisión n.º {number} del {time}</translation>
    </message>
    <message>
        <source>Decision #{number}</source>
        <translation>Decisión n.º {number}</translation>
    </message>
    <message>
        <source>Decision: {not_recorded} (draft plan)</source>
        <translation>Decisión: {not_recorded} (borrador del plan)</translation>
    </message>
    <message>
        <source>not recorded</source>
        <translation>no registrada</translation>
    </message>
    <message>
        <source>Date</source>
        <translation>Fecha</translation>
    </message>
    <message>
        <source>Shift</source>
        <translation>Turno</translation>
    </message>
    <message>
        <source>Printed {time}</source>
        <translation>Impresa {time}</translation>
    </message>
    <message>
        <source>Page {page} of {pages}</source>
        <translation>Página {page} de {pages}</translation>
    </message>
    <message>
        <source>SAFETY:</source>
        <translation>SEGURIDAD:</translation>
    </message>
</context>
<context>
    <name>SheetPrinting</name>
    <message>
        <source>Nothing to print</source>
        <translation>Nada que imprimir</translation>
    </message>
    <message>
        <source>There is no plan yet: fix the grid first.</source>
        <translation>Todavía no hay plan: corrija primero la cuadrícula.</translation>
    </message>
    <message>
        <source>PDF not written</source>
        <translation>PDF no escrito</translation>
    </message>
    <message numerus="yes">
        <source>Wrote %n page(s) to {path}</source>
        <translation>
            <numerusform>%n página escrita en {path}</numerusform>
            <numerusform>%n páginas escritas en {path}</numerusform>
        </translation>
    </message>
    <message>
        <source>Dispatch sheet - print preview</source>
        <translation>Hoja de asignación - vista previa de impresión</translation>
    </message>
    <message>
        <source>Export dispatch sheet</source>
        <translation>Exportar hoja de asignación</translation>
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
        <translation>Taller sin título</translation>
    </message>
</context>
<context>
    <name>TimelineTab</name>
    <message>
        <source>Timeline</source>
        <translation>Cronograma</translation>
    </message>
    <message>
        <source>The whole-shift plan drawn per machine on the shift&apos;s hours</source>
        <translation>El plan del turno completo dibujado por máquina sobre las horas del turno</translation>
    </message>
    <message>
        <source>Solid: a planned job   dotted: already running   hatched: changeover before the job   cross-hatched: change into the end family   dashed line: end of the machine&apos;s hours</source>
        <translation>Lleno: un trabajo planificado   punteado: ya en marcha   rayado: cambio antes del trabajo   cuadriculado: cambio a la familia final   línea discontinua: fin de las horas de la máquina</translation>
    </message>
    <message>
        <source>The timeline shows whole-shift plans: choose Plan &gt; Whole shift (Ctrl+5).</source>
        <translation>El cronograma muestra planes del turno completo: elija Plan &gt; Turno completo (Ctrl+5).</translation>
    </message>
    <message>
        <source>proven optimal</source>
        <translation>óptimo demostrado</translation>
    </message>
    <message>
        <source>gap at most {gap} % (proven lower bound {bound})</source>
        <translation>brecha como máximo {gap} % (cota inferior demostrada {bound})</translation>
    </message>
    <message>
        <source>Whole-shift plan: total {total} {unit}, {gap}.</source>
        <translation>Plan del turno completo: total {total} {unit}, {gap}.</translation>
    </message>
</context>
<context>
    <name>TimelineView</name>
    <message>
        <source>Shift timeline</source>
        <extracomment>Fill colour and pattern of each kind of bar (never colour alone).</extracomment>
        <translation>Cronograma del turno</translation>
    </message>
    <message>
        <source>One lane per machine; a bar per job on the shift&apos;s hours, changeovers hatched; arrow keys step through the bars</source>
        <translation>Una fila por máquina; una barra por trabajo sobre las horas del turno, cambios rayados; las flechas recorren las barras</translation>
    </message>
    <message>
        <source>{hours} h</source>
        <translation>{hours} h</translation>
    </message>
    <message>
        <source>no family</source>
        <translation>sin familia</translation>
    </message>
    <message>
        <source>{start} to {end}</source>
        <translation>de {start} a {end}</translation>
    </message>
    <message>
        <source>{machine}: {job} already running ({family}), until {end}</source>
        <translation>{machine}: {job} ya en marcha ({family}), hasta {end}</translation>
    </message>
    <message>
        <source>{machine}: change from {a} to the end family {b}: {value} {unit}, {span}</source>
        <translation>{machine}: cambio de {a} a la familia final {b}: {value} {unit}, {span}</translation>
    </message>
    <message>
        <source>nothing mounted</source>
        <translation>nada montado</translation>
    </message>
    <message>
        <source>change from {a} to {b}: {value} {unit}</source>
        <translation>cambio de {a} a {b}: {value} {unit}</translation>
    </message>
    <message>
        <source>no changeover priced</source>
        <translation>ningún cambio valorado</translation>
    </message>
    <message>
        <source>{machine}: before {job}, {change} ({span})</source>
        <translation>{machine}: antes de {job}, {change} ({span})</translation>
    </message>
    <message>
        <source>{machine}: {job}, family {family}, {span}; {change}</source>
        <translation>{machine}: {job}, familia {family}, {span}; {change}</translation>
    </message>
</context>
<context>
    <name>WhatIfModel</name>
    <message>
        <source>down</source>
        <translation>averiada</translation>
    </message>
    <message>
        <source>maintenance</source>
        <translation>mantenimiento</translation>
    </message>
    <message>
        <source>less value</source>
        <translation>menos valor</translation>
    </message>
    <message>
        <source>more</source>
        <translation>más</translation>
    </message>
    <message>
        <source>{job} on {machine}: value - (cannot run)</source>
        <translation>{job} en {machine}: valor - (no puede)</translation>
    </message>
    <message>
        <source>{job} on {machine}: value {value} {unit}</source>
        <translation>{job} en {machine}: valor {value} {unit}</translation>
    </message>
    <message>
        <source>{job} is {state}: it is not dispatched this round</source>
        <translation>{job} está {state}: no se asigna en esta ronda</translation>
    </message>
    <message>
        <source>running</source>
        <translation>en marcha</translation>
    </message>
    <message>
        <source>done</source>
        <translation>terminado</translation>
    </message>
    <message>
        <source>The plan puts {job} on {machine} (value {value})</source>
        <translation>El plan pone {job} en {machine} (valor {value})</translation>
    </message>
    <message>
        <source>The plan leaves {job} waiting</source>
        <translation>El plan deja {job} en espera</translation>
    </message>
    <message>
        <source>Best other machine: {machine} (+{extra} {more} in total)</source>
        <translation>Mejor máquina alternativa: {machine} (+{extra} {more} en total)</translation>
    </message>
    <message>
        <source>No other machine can take it in any plan</source>
        <translation>Ninguna otra máquina puede aceptarlo en ningún plan</translation>
    </message>
    <message>
        <source>This is the plan&apos;s choice: extra cost 0</source>
        <translation>Esta es la elección del plan: coste extra 0</translation>
    </message>
    <message>
        <source>Forcing this pair is impossible: no plan placing as many jobs contains it</source>
        <translation>Forzar esta pareja es imposible: ningún plan que asigne tantos trabajos la contiene</translation>
    </message>
    <message>
        <source>Forcing this pair: +{extra} {more} in total than the plan</source>
        <translation>Forzar esta pareja: +{extra} {more} en total que el plan</translation>
    </message>
    <message>
        <source>Keeping it waiting instead: +{extra}</source>
        <translation>Dejarlo esperar en su lugar: +{extra}</translation>
    </message>
</context>
<context>
    <name>WhatIfTab</name>
    <message>
        <source>what-if costs failed: {error}</source>
        <translation>los costes qué pasaría si fallaron: {error}</translation>
    </message>
    <message>
        <source>What-if costs cancelled</source>
        <translation>Costes qué pasaría si cancelados</translation>
    </message>
    <message>
        <source>No plan yet</source>
        <translation>Todavía no hay plan</translation>
    </message>
    <message>
        <source>What-if costs are for one dispatch round (Plan menu: One round)</source>
        <translation>Los costes qué pasaría si son para una ronda de asignación (menú Plan: Una ronda)</translation>
    </message>
    <message>
        <source>What-if costs are for the &apos;least total&apos; and &apos;most value&apos; objectives (switch in the Plan menu)</source>
        <translation>Los costes qué pasaría si son para los objetivos &apos;Menor total&apos; y &apos;Mayor valor&apos; (cámbielo en el menú Plan)</translation>
    </message>
    <message>
        <source>Computing…</source>
        <translation>Calculando…</translation>
    </message>
</context>
<context>
    <name>WhatIfView</name>
    <message>
        <source>Extra cost against the plan shown if a job is forced onto a machine. {planned} = the plan&apos;s choice (0); darker = dearer; {cannot} = impossible; {idle} = running or done. Hover a cell for details.</source>
        <translation>Coste extra frente al plan mostrado si se fuerza un trabajo en una máquina. {planned} = elección del plan (0); más oscuro = más caro; {cannot} = imposible; {idle} = en marcha o terminado. Pase el ratón por una celda para ver detalles.</translation>
    </message>
    <message>
        <source>What the map shows</source>
        <translation>Qué muestra el mapa</translation>
    </message>
    <message>
        <source>What-if status</source>
        <translation>Estado del qué pasaría si</translation>
    </message>
    <message>
        <source>The dearest forced pair, or why the map is empty</source>
        <translation>La pareja forzada más cara, o por qué el mapa está vacío</translation>
    </message>
    <message>
        <source>What-if map</source>
        <translation>Mapa qué pasaría si</translation>
    </message>
    <message>
        <source>Jobs as rows, machines as columns: the extra cost if the job is forced onto the machine</source>
        <translation>Trabajos en filas, máquinas en columnas: el coste extra si el trabajo se fuerza en la máquina</translation>
    </message>
    <message>
        <source>Largest extra: {extra} {unit}</source>
        <translation>Mayor coste extra: {extra} {unit}</translation>
    </message>
    <message>
        <source>The dearest single forced pair, against the plan shown</source>
        <translation>La pareja forzada individual más cara, frente al plan mostrado</translation>
    </message>
</context>
</TS>
