using System.Collections.Concurrent;
using System.Diagnostics;
using System.Net.WebSockets;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using SlotOpt.Tests.Cli;

namespace SlotOpt.Tests.Reports;

/// <summary>
/// Headless Chromium driven over the DevTools protocol (a WebSocket to 127.0.0.1): open a page, wait for
/// its load event, evaluate script, take a screenshot, and keep every network request the page made.
/// Started with every background-networking feature off and a host resolver that resolves nothing, so
/// even a request the page should not make cannot leave the machine; the test then checks none was tried.
/// </summary>
public sealed class HeadlessChromium : IAsyncDisposable
{
    public static readonly string[] Candidates = ["/usr/bin/chromium", "/usr/bin/chromium-browser", "/usr/bin/google-chrome"];

    private readonly Process process;
    private readonly string profile;
    private readonly ClientWebSocket socket = new();
    private readonly ConcurrentDictionary<int, TaskCompletionSource<JsonNode>> pending = new();
    private readonly CancellationTokenSource stop = new();
    private Task? receiver;
    private int nextId;
    private string? sessionId;

    /// <summary>Every CDP event received, in order: method and params.</summary>
    public ConcurrentQueue<(string Method, JsonNode Params)> Events { get; } = new();

    private HeadlessChromium(Process process, string profile)
    {
        this.process = process;
        this.profile = profile;
    }

    /// <exception cref="InvalidOperationException">No Chromium on this machine (.ci/run installs the Debian package `chromium`).</exception>
    public static async Task<HeadlessChromium> StartAsync(TimeSpan timeout)
    {
        var exe = Candidates.FirstOrDefault(File.Exists)
            ?? throw new InvalidOperationException($"no Chromium found (looked for {string.Join(", ", Candidates)}); install the Debian package 'chromium' (.ci/run does)");
        var profile = Directory.CreateTempSubdirectory("slotopt-chromium-").FullName;
        var start = new ProcessStartInfo(exe) { UseShellExecute = false, RedirectStandardError = true, RedirectStandardOutput = true };
        foreach (var a in new[]
                 {
                     "--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking",
                     "--disable-component-update", "--disable-sync", "--disable-default-apps", "--disable-extensions", "--no-default-browser-check",
                     "--host-resolver-rules=MAP * ~NOTFOUND", $"--user-data-dir={profile}", "--remote-debugging-address=127.0.0.1", "--remote-debugging-port=0", "about:blank",
                 })
            start.ArgumentList.Add(a);
        var process = Process.Start(start)!;
        process.OutputDataReceived += (_, _) => { };
        process.ErrorDataReceived += (_, _) => { };
        process.BeginOutputReadLine();
        process.BeginErrorReadLine();
        var browser = new HeadlessChromium(process, profile);
        // with port 0 Chromium picks a free port and writes it, and the browser's WebSocket path, to DevToolsActivePort
        var portFile = Path.Combine(profile, "DevToolsActivePort");
        var clock = Stopwatch.StartNew();
        string[] lines = [];
        while (clock.Elapsed < timeout && !process.HasExited)
        {
            if (File.Exists(portFile) && (lines = File.ReadAllLines(portFile)).Length >= 2) break;
            await Task.Delay(50);
        }
        if (lines.Length < 2)
        {
            await browser.DisposeAsync();
            throw new InvalidOperationException($"Chromium did not open its DevTools port within {timeout.TotalSeconds:0} s");
        }
        await browser.socket.ConnectAsync(new Uri($"ws://127.0.0.1:{lines[0]}{lines[1]}"), CancellationToken.None);
        browser.receiver = Task.Run(browser.ReceiveLoop);
        return browser;
    }

    /// <summary>Opens a new tab and attaches to it; later commands go to that tab.</summary>
    public async Task OpenTabAsync(int widthPx, int heightPx)
    {
        var target = await SendAsync("Target.createTarget", new JsonObject { ["url"] = "about:blank" }, browserLevel: true);
        var attached = await SendAsync("Target.attachToTarget", new JsonObject { ["targetId"] = target["targetId"]!.GetValue<string>(), ["flatten"] = true }, browserLevel: true);
        sessionId = attached["sessionId"]!.GetValue<string>();
        await SendAsync("Network.enable", new JsonObject());
        await SendAsync("Page.enable", new JsonObject());
        await SendAsync("Emulation.setDeviceMetricsOverride", new JsonObject { ["width"] = widthPx, ["height"] = heightPx, ["deviceScaleFactor"] = 1, ["mobile"] = false });
    }

    /// <summary>Navigates and waits for the page's load event (every image in it loaded or failed).</summary>
    public async Task NavigateAsync(string url, TimeSpan timeout)
    {
        var before = Events.Count;
        await SendAsync("Page.navigate", new JsonObject { ["url"] = url });
        var clock = Stopwatch.StartNew();
        while (!Events.Skip(before).Any(e => e.Method == "Page.loadEventFired"))
        {
            if (clock.Elapsed > timeout) throw new TimeoutException($"{url} did not finish loading within {timeout.TotalSeconds:0} s");
            await Task.Delay(20);
        }
    }

    public async Task<JsonNode?> EvaluateAsync(string expression)
    {
        var result = await SendAsync("Runtime.evaluate", new JsonObject { ["expression"] = expression, ["returnByValue"] = true });
        if (result["exceptionDetails"] is { } error) throw new InvalidOperationException($"script failed: {error.ToJsonString()}");
        return result["result"]!["value"];
    }

    /// <summary>A PNG of the whole page, beyond the viewport.</summary>
    public async Task<byte[]> ScreenshotAsync()
    {
        var shot = await SendAsync("Page.captureScreenshot", new JsonObject { ["format"] = "png", ["captureBeyondViewport"] = true });
        return Convert.FromBase64String(shot["data"]!.GetValue<string>());
    }

    /// <summary>The URL of every request the page sent or tried to send (Network.requestWillBeSent).</summary>
    public IReadOnlyList<string> RequestedUrls =>
        Events.Where(e => e.Method == "Network.requestWillBeSent").Select(e => e.Params["request"]!["url"]!.GetValue<string>()).ToList();

    private async Task<JsonNode> SendAsync(string method, JsonObject parameters, bool browserLevel = false)
    {
        var id = Interlocked.Increment(ref nextId);
        var message = new JsonObject { ["id"] = id, ["method"] = method, ["params"] = parameters };
        if (!browserLevel) message["sessionId"] = sessionId;
        var reply = new TaskCompletionSource<JsonNode>(TaskCreationOptions.RunContinuationsAsynchronously);
        pending[id] = reply;
        await socket.SendAsync(Encoding.UTF8.GetBytes(message.ToJsonString()), WebSocketMessageType.Text, true, CancellationToken.None);
        var done = await Task.WhenAny(reply.Task, Task.Delay(SlotOptProcess.HangGuard));   // a hang guard only
        if (done != reply.Task) throw new TimeoutException($"Chromium did not answer {method}");
        var answer = await reply.Task;
        if (answer["error"] is { } error) throw new InvalidOperationException($"{method}: {error.ToJsonString()}");
        return answer["result"]!;
    }

    private async Task ReceiveLoop()
    {
        var buffer = new byte[1 << 16];
        var message = new MemoryStream();
        try
        {
            while (socket.State == WebSocketState.Open && !stop.IsCancellationRequested)
            {
                var part = await socket.ReceiveAsync(buffer, stop.Token);
                if (part.MessageType == WebSocketMessageType.Close) break;
                message.Write(buffer, 0, part.Count);
                if (!part.EndOfMessage) continue;
                var node = JsonNode.Parse(message.ToArray())!;
                message.SetLength(0);
                if (node["id"] is { } id && pending.TryRemove(id.GetValue<int>(), out var reply)) reply.SetResult(node);
                else if (node["method"] is { } method) Events.Enqueue((method.GetValue<string>(), node["params"] ?? new JsonObject()));
            }
        }
        catch (OperationCanceledException) { }
        catch (WebSocketException) { }
    }

    public async ValueTask DisposeAsync()
    {
        stop.Cancel();
        if (receiver is not null) await Task.WhenAny(receiver, Task.Delay(2000));
        socket.Dispose();
        if (!process.HasExited) process.Kill(entireProcessTree: true);
        await process.WaitForExitAsync();
        process.Dispose();
        try { Directory.Delete(profile, recursive: true); } catch (IOException) { /* Chromium may still hold a lock file for a moment */ }
    }
}
