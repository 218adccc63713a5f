<?xml version="1.0" encoding="utf-8"?>
<!DOCTYPE TS>
<TS version="2.1" language="es_ES">
<context>
    <name>MainWindow</name>
    <message>
        <source>&amp;Grid</source>
        <translation>&amp;Cuadrícula</translation>
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
</TS>
