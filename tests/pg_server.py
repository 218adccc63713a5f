"""A throw-away PostgreSQL server for the tests and benchmarks (never a mock).

``initdb`` and ``pg_ctl`` from Debian's ``postgresql`` package (``/usr/lib/postgresql/<v>/bin``,
or ``$DISPATCHER_PG_BIN``) build a cluster in a temporary folder that listens only on a Unix
socket in that folder, and stop it at the end. ``initdb`` refuses to run as root, so when
the tests run as root (CI) the server runs as the unprivileged ``postgres`` user the
package creates, through ``runuser``; the client connects as the database role
``postgres`` over the socket (``trust`` for that socket only), except the role ``pw_user``
which needs a password (to test a refused login).

Without the binaries the PostgreSQL tests skip with a message; with
``DISPATCHER_REQUIRE_POSTGRES=1`` (CI) they fail instead.
"""

from __future__ import annotations

import glob
import os
import shutil
import signal
import subprocess
import tempfile
import time
from pathlib import Path

REQUIRE_ENV = "DISPATCHER_REQUIRE_POSTGRES"
DATABASE = "dispatcher_test"


def find_bin() -> Path | None:
    given = os.environ.get("DISPATCHER_PG_BIN")
    if given:
        return Path(given)
    found = sorted(glob.glob("/usr/lib/postgresql/*/bin/initdb"),
                   key=lambda p: int(Path(p).parts[-3]) if Path(p).parts[-3].isdigit() else 0)
    if found:
        return Path(found[-1]).parent
    initdb = shutil.which("initdb")
    return Path(initdb).parent if initdb else None


def unavailable_reason() -> str | None:
    """Why no server can be started here, or None."""
    pg_bin = find_bin()
    if pg_bin is None or not (pg_bin / "initdb").exists():
        return ("PostgreSQL server binaries (initdb, pg_ctl) not found: install Debian's "
                "postgresql package or set DISPATCHER_PG_BIN")
    try:
        import psycopg  # noqa: F401
    except ImportError:
        return "psycopg is not installed (pip install '.[postgres]')"
    if os.geteuid() == 0 and not shutil.which("runuser"):
        return "running as root without runuser to start the server as 'postgres'"
    return None


class PgServer:
    def __init__(self, fsync: bool = False):
        self.bin = find_bin()
        self.root = Path(tempfile.mkdtemp(prefix="dispatcher-pg-"))
        self.data = self.root / "data"
        self.sock = self.root / "sock"
        self.sock.mkdir()
        self.as_root = os.geteuid() == 0
        self.fsync = fsync
        if self.as_root:
            self.root.chmod(0o755)
            shutil.chown(self.root, "postgres", "postgres")
            shutil.chown(self.sock, "postgres", "postgres")

    def _run(self, *argv: str, check: bool = True) -> subprocess.CompletedProcess:
        cmd = [str(self.bin / argv[0]), *argv[1:]]
        if self.as_root:
            cmd = ["runuser", "-u", "postgres", "--", *cmd]
        return subprocess.run(cmd, check=check, capture_output=True, text=True,
                              env=dict(os.environ, LC_ALL="C"))

    def init(self) -> None:
        self._run("initdb", "-D", str(self.data), "-U", "postgres", "-A", "trust",
                  "-E", "UTF8", "--locale=C", "--no-sync")
        (self.data / "pg_hba.conf").write_text(
            "local all pw_user scram-sha-256\nlocal all all trust\n")
        with (self.data / "postgresql.conf").open("a") as f:
            f.write(f"\nlisten_addresses = ''\nunix_socket_directories = '{self.sock}'\n"
                    f"fsync = {'on' if self.fsync else 'off'}\nmax_connections = 60\n"
                    "shared_buffers = 32MB\n")
        self.start()
        self.psql(f"CREATE DATABASE {DATABASE}", db="postgres")
        self.psql("CREATE ROLE pw_user LOGIN PASSWORD 'only-for-this-test'", db="postgres")

    def start(self) -> None:
        self._run("pg_ctl", "-D", str(self.data), "-l", str(self.root / "server.log"),
                  "-w", "-t", "60", "start")

    def stop(self, mode: str = "fast") -> None:
        self._run("pg_ctl", "-D", str(self.data), "-m", mode, "-w", "stop", check=False)

    def kill(self) -> None:
        """SIGKILL the postmaster and every server process (a crash, not a shutdown)."""
        pid = int((self.data / "postmaster.pid").read_text().split()[0])
        children = []
        for stat in glob.glob("/proc/[0-9]*/stat"):
            try:
                fields = Path(stat).read_text().rsplit(")", 1)[1].split()
            except OSError:
                continue
            if int(fields[1]) == pid:
                children.append(int(Path(stat).parent.name))
        for p in [pid, *children]:
            try:
                os.kill(p, signal.SIGKILL)
            except ProcessLookupError:
                pass
        deadline = time.monotonic() + 20
        while time.monotonic() < deadline and any(Path(f"/proc/{p}").exists()
                                                   for p in [pid, *children]):
            time.sleep(0.05)

    def psql(self, sql: str, db: str = DATABASE) -> None:
        import psycopg
        with psycopg.connect(self.uri(db=db), autocommit=True) as conn:
            conn.execute(sql)

    def uri(self, schema: str | None = None, user: str = "postgres", db: str = DATABASE) -> str:
        uri = f"postgresql://{user}@/{db}?host={self.sock}"
        if schema:
            uri += f"&options=-csearch_path%3D{schema}"
        return uri

    def cleanup(self) -> None:
        self.stop("immediate")
        shutil.rmtree(self.root, ignore_errors=True)
