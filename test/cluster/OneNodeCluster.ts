// A throwaway one-node Slurm cluster on this machine for the cluster test: munged, slurmctld
// and slurmd run in the foreground as children of the test (so stopping them is a kill of a
// known pid, never a search by name), with a generated slurm.conf, key, state and spool in one
// temporary folder. Every address is 127.0.0.1; ports are free ones picked at start, so several
// test runs on one machine do not meet. stop() ends every daemon it started, also after a failure.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { chmodSync, existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { hostname, tmpdir } from 'node:os';
import { join } from 'node:path';

/** A TCP port nobody listens on right now (127.0.0.1). */
function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.on('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as { port: number };
      server.close(() => resolve(port));
    });
  });
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

export interface CommandResult {
  status: number | null;
  stdout: string;
  stderr: string;
}

export class OneNodeCluster {
  readonly dir: string;
  readonly node = hostname().split('.')[0]!;
  private readonly children: { name: string; child: ChildProcess }[] = [];
  private conf = '';
  private socket = '';

  constructor() {
    this.dir = mkdtempSync(join(tmpdir(), 'alight-slurm-'));
    chmodSync(this.dir, 0o755); // munged wants every directory above its socket searchable by all
  }

  /** Environment for Slurm's client commands (sbatch, squeue, ...): our slurm.conf. */
  get env(): NodeJS.ProcessEnv {
    return { ...process.env, SLURM_CONF: this.conf };
  }

  /** Run a Slurm client command against this cluster. */
  run(command: string, args: string[], env: NodeJS.ProcessEnv = {}): CommandResult {
    const r = spawnSync(command, args, { env: { ...this.env, ...env }, encoding: 'utf8', timeout: 30_000 });
    return { status: r.status, stdout: r.stdout ?? '', stderr: r.stderr ?? String(r.error ?? '') };
  }

  private daemon(name: string, command: string, args: string[]): void {
    const child = spawn(command, args, { stdio: ['ignore', 'ignore', 'pipe'], env: this.env });
    let stderr = '';
    child.stderr!.on('data', (d: Buffer) => void (stderr = (stderr + d.toString()).slice(-4000)));
    child.on('exit', (code, signal) => {
      if (code !== 0 && signal === null) writeFileSync(join(this.dir, `${name}.exit`), `${name} exited ${code}: ${stderr}`);
    });
    this.children.push({ name, child });
  }

  /** Start munged, slurmctld and slurmd; resolves when the node reports idle (or throws, with the daemons' logs). */
  async start(cpus: number): Promise<void> {
    const d = this.dir;
    const key = join(d, 'munge.key');
    writeFileSync(key, randomBytes(1024), { mode: 0o600 });
    this.socket = join(d, 'munge.socket');
    this.daemon('munged', '/usr/sbin/munged', ['--foreground', `--key-file=${key}`, `--socket=${this.socket}`, `--pid-file=${join(d, 'munged.pid')}`, `--log-file=${join(d, 'munged.log')}`, `--seed-file=${join(d, 'munged.seed')}`]);
    for (let i = 0; i < 100 && !existsSync(this.socket); i++) await sleep(100);
    if (!existsSync(this.socket)) throw new Error(`munged did not start: ${this.logs()}`);

    const [ctldPort, slurmdPort] = [await freePort(), await freePort()];
    mkdirSync(join(d, 'state'));
    mkdirSync(join(d, 'spool'));
    this.conf = join(d, 'slurm.conf');
    writeFileSync(
      this.conf,
      [
        `ClusterName=alight${ctldPort}`,
        `SlurmctldHost=${this.node}(127.0.0.1)`,
        `SlurmctldPort=${ctldPort}`,
        `SlurmdPort=${slurmdPort}`,
        'SlurmUser=root',
        'SlurmdUser=root',
        'AuthType=auth/munge',
        'CredType=cred/munge',
        `AuthInfo=socket=${this.socket}`,
        `StateSaveLocation=${join(d, 'state')}`,
        `SlurmdSpoolDir=${join(d, 'spool')}`,
        `SlurmctldPidFile=${join(d, 'slurmctld.pid')}`,
        `SlurmdPidFile=${join(d, 'slurmd.pid')}`,
        `SlurmctldLogFile=${join(d, 'slurmctld.log')}`,
        `SlurmdLogFile=${join(d, 'slurmd.log')}`,
        `PlugStackConfig=${join(d, 'plugstack.conf')}`,
        'ProctrackType=proctrack/linuxproc',
        'TaskPlugin=task/none',
        'SwitchType=switch/none',
        'MpiDefault=none',
        'SelectType=select/cons_tres',
        'SelectTypeParameters=CR_CPU',
        'SchedulerType=sched/builtin',
        'ReturnToService=2',
        'JobCompType=jobcomp/none',
        'JobAcctGatherType=jobacct_gather/none',
        'AccountingStorageType=accounting_storage/none',
        'MailProg=/bin/true',
        'MinJobAge=600',
        `NodeName=${this.node} NodeAddr=127.0.0.1 NodeHostname=${this.node} CPUs=${cpus} RealMemory=1024 State=UNKNOWN`,
        `PartitionName=alight Nodes=${this.node} Default=YES MaxTime=INFINITE State=UP`,
        '',
      ].join('\n'),
    );
    writeFileSync(join(d, 'plugstack.conf'), '');
    this.daemon('slurmctld', '/usr/sbin/slurmctld', ['-D', '-i', '-f', this.conf]);
    this.daemon('slurmd', '/usr/sbin/slurmd', ['-D', '-N', this.node, '-f', this.conf]);
    for (let i = 0; i < 600; i++) {
      const state = this.run('/usr/bin/sinfo', ['-h', '-N', '-o', '%t']).stdout.trim();
      if (state === 'idle') return;
      if (this.children.some((c) => c.child.exitCode !== null)) break;
      await sleep(200);
    }
    throw new Error(`the one-node cluster did not come up: ${this.logs()}`);
  }

  /** The tail of every daemon log, for failure messages. */
  logs(): string {
    return ['munged.log', 'slurmctld.log', 'slurmd.log', 'munged.exit', 'slurmctld.exit', 'slurmd.exit']
      .filter((f) => existsSync(join(this.dir, f)))
      .map((f) => `--- ${f}\n${readFileSync(join(this.dir, f), 'utf8').split('\n').slice(-15).join('\n')}`)
      .join('\n');
  }

  /** Stop every daemon this cluster started (TERM, then KILL after 10 s) and remove its folder. */
  async stop(): Promise<void> {
    for (const { child } of [...this.children].reverse()) {
      if (child.exitCode !== null || child.signalCode !== null) continue;
      const exited = new Promise<void>((r) => child.once('exit', () => r()));
      child.kill('SIGTERM');
      const timer = setTimeout(() => child.kill('SIGKILL'), 10_000);
      await exited;
      clearTimeout(timer);
    }
    this.children.length = 0;
    rmSync(this.dir, { recursive: true, force: true });
  }
}
