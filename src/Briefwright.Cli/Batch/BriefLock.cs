using System.Text.Json;

namespace Briefwright.Cli.Batch;

/// <summary>Who holds a brief's lock: written into the lock file.</summary>
public sealed record LockInfo(string Host, int Pid, string Token, DateTime StartedUtc);

/// <summary>Another build holds the brief's lock and showed signs of life for the whole wait.</summary>
public sealed class LockHeldException(string message) : IOException(message);

/// <summary>
/// A lock on one brief in one output folder, across processes and machines that share the folder: the file
/// <c>.briefwright-tmp/&lt;id&gt;.lock</c>, created only if absent (O_EXCL; also on NFS v3+ and SMB), holding host,
/// process id, a random token and the start time. The holder touches it every few seconds; a lock whose file has not
/// been touched for <see cref="StaleAfter"/> is judged abandoned (a killed build) and taken over. A process id is never
/// used to judge a lock: on another machine the same number means nothing. Only the holder of a brief's lock writes the
/// brief, its staging folder, its journal or its archive, so whatever of these the holder finds was left by a build
/// that is gone.
/// </summary>
public sealed class BriefLock : IDisposable
{
    public static TimeSpan StaleAfter { get; } = TimeSpan.FromSeconds(60);
    private static readonly TimeSpan Heartbeat = TimeSpan.FromSeconds(5);
    private static readonly TimeSpan MaxWait = TimeSpan.FromMinutes(10);
    private static readonly List<BriefLock> Held = [];
    private static readonly Timer Beat = new(_ => Touch(), null, Heartbeat, Heartbeat);

    public string Path { get; }
    public LockInfo Info { get; }

    /// <summary>What the lock replaced, for the build's report (a stale lock of a build that is gone).</summary>
    public string? TookOver { get; }

    private BriefLock(string path, LockInfo info, string? tookOver)
    {
        Path = path;
        Info = info;
        TookOver = tookOver;
        lock (Held) Held.Add(this);
    }

    /// <summary>
    /// Takes the lock, waiting while another live build holds it (reported once to <paramref name="waiting"/>).
    /// </summary>
    public static BriefLock Acquire(string tempDir, string id, Action<string> waiting, CancellationToken stop = default)
    {
        string path = System.IO.Path.Combine(tempDir, id + ".lock");
        var info = new LockInfo(
            Environment.MachineName, Environment.ProcessId, Guid.NewGuid().ToString("N"), DateTime.UtcNow);
        byte[] bytes = JsonSerializer.SerializeToUtf8Bytes(info, BatchJsonContext.Default.LockInfo);
        var started = DateTime.UtcNow;
        bool told = false;
        string? tookOver = null;
        while (true)
        {
            try
            {
                Directory.CreateDirectory(tempDir);
                using (var stream = new FileStream(path, FileMode.CreateNew, FileAccess.Write, FileShare.Read))
                {
                    stream.Write(bytes);
                    stream.Flush(flushToDisk: true);
                }
                return new BriefLock(path, info, tookOver);
            }
            catch (DirectoryNotFoundException)
            {
                continue; // another build removed the empty temporary folder just now
            }
            catch (IOException) when (File.Exists(path))
            {
                // Held: judge it by the age of its last sign of life.
            }
            var (holder, age) = Read(path);
            if (holder is null && age is null) continue; // released just now
            if (age > StaleAfter)
            {
                if (Break(path, holder)) tookOver = "took over the lock of a build that showed no sign of life for " +
                    $"{age.Value.TotalSeconds:0} s ({Describe(holder)})";
                continue;
            }
            if (!told)
            {
                waiting($"waiting for another build ({Describe(holder)}) that holds {path}; a lock untouched for " +
                    $"{StaleAfter.TotalSeconds:0} s is taken over");
                told = true;
            }
            if (DateTime.UtcNow - started > MaxWait)
                throw new LockHeldException($"another build ({Describe(holder)}) has held {path} for over " +
                    $"{MaxWait.TotalMinutes:0} minutes");
            if (stop.WaitHandle.WaitOne(100)) throw new OperationCanceledException(stop);
        }
    }

    private static string Describe(LockInfo? holder) =>
        holder is null
            ? "unreadable lock file"
            : $"host {holder.Host}, process {holder.Pid}, started {holder.StartedUtc:yyyy-MM-dd HH:mm:ss} UTC";

    private static (LockInfo? Info, TimeSpan? Age) Read(string path)
    {
        try
        {
            var written = File.GetLastWriteTimeUtc(path);
            if (!File.Exists(path)) return (null, null);
            LockInfo? info = null;
            try { info = JsonSerializer.Deserialize(File.ReadAllBytes(path), BatchJsonContext.Default.LockInfo); }
            catch (JsonException) { } // being written, or damaged: judged by age alone
            var age = DateTime.UtcNow - written;
            return (info, age < TimeSpan.Zero ? TimeSpan.Zero : age);
        }
        catch (IOException)
        {
            return (null, null);
        }
    }

    /// <summary>
    /// Removes a stale lock so that exactly one waiter can then create its own: the file is first renamed to a name of
    /// this process's own (only one rename of it can succeed) and deleted only if it is still the stale one judged.
    /// </summary>
    private static bool Break(string path, LockInfo? judged)
    {
        string aside = $"{path}.stale.{Guid.NewGuid():N}";
        try
        {
            File.Move(path, aside);
        }
        catch (IOException)
        {
            return false; // someone else broke it first
        }
        var (now, _) = Read(aside);
        if (judged is not null && now is not null && now.Token != judged.Token)
        {
            // A fresh lock was taken between our judgement and the rename: give it back.
            try { File.Move(aside, path); } catch (IOException) { }
            return false;
        }
        try { File.Delete(aside); } catch (IOException) { }
        return true;
    }

    /// <summary>True while the lock file is still this holder's (another build may have judged it stale).</summary>
    public bool StillHeld()
    {
        try
        {
            return JsonSerializer.Deserialize(File.ReadAllBytes(Path), BatchJsonContext.Default.LockInfo)?.Token
                == Info.Token;
        }
        catch (Exception ex) when (ex is IOException or JsonException or UnauthorizedAccessException)
        {
            return false;
        }
    }

    private static void Touch()
    {
        BriefLock[] held;
        lock (Held) held = Held.ToArray();
        foreach (var l in held)
            try { File.SetLastWriteTimeUtc(l.Path, DateTime.UtcNow); }
            catch (Exception) { /* judged at the next step */ }
    }

    public void Dispose()
    {
        lock (Held) Held.Remove(this);
        if (StillHeld())
            try { File.Delete(Path); } catch (IOException) { }
        try { Directory.Delete(System.IO.Path.GetDirectoryName(Path)!); } catch (IOException) { } // only when empty
    }
}
