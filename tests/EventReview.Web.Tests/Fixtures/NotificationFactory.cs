using EventReview.Web.Notifications;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.TestHost;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Web.Tests.Fixtures;

/// <summary>
/// The app with e-mail through a <see cref="TestSmtpServer"/>, webhooks allowed to local http addresses, a movable
/// clock (<see cref="Clock"/>) and no background worker unless <see cref="PollSeconds"/> is set: tests run
/// <see cref="NotificationPump.RunOnceAsync"/> themselves.
/// </summary>
public class NotificationFactory : EventReviewFactory
{
    public TestClock Clock { get; } = new();

    public TestSmtpServer Smtp { get; } = new();

    /// <summary>Seconds between the background worker's passes; 0 (default): no worker.</summary>
    public int PollSeconds { get; init; }

    /// <summary>SMTP port to use instead of the test server's (e.g. one where nothing listens).</summary>
    public int? SmtpPort { get; init; }

    /// <summary>One pass of the worker, now.</summary>
    public Task<NotificationPump.Pass> PumpAsync() => Services.GetRequiredService<NotificationPump>().RunOnceAsync();

    protected override Task StartAsync()
    {
        if (SmtpPort is null)
        {
            Smtp.Start();
        }

        return base.StartAsync();
    }

    protected override async Task StopAsync()
    {
        await base.StopAsync();
        await Smtp.DisposeAsync();
    }

    protected override void ConfigureWebHost(IWebHostBuilder builder)
    {
        base.ConfigureWebHost(builder);
        builder.UseSetting("EventReview:Notifications:PollSeconds", PollSeconds.ToString(System.Globalization.CultureInfo.InvariantCulture));
        builder.UseSetting("EventReview:Notifications:BaseUrl", "https://review.example.org");
        builder.UseSetting("EventReview:Notifications:Smtp:Host", "127.0.0.1");
        builder.UseSetting("EventReview:Notifications:Smtp:Port", (SmtpPort ?? Smtp.Port).ToString(System.Globalization.CultureInfo.InvariantCulture));
        builder.UseSetting("EventReview:Notifications:Smtp:Security", "None");
        builder.UseSetting("EventReview:Notifications:Smtp:From", "EventReview <review-noreply@example.org>");
        builder.UseSetting("EventReview:Notifications:Smtp:TimeoutSeconds", "5");
        builder.UseSetting("EventReview:Notifications:Webhooks:RequireHttps", "false");
        builder.UseSetting("EventReview:Notifications:Webhooks:AllowPrivateAddresses", "true");
        builder.ConfigureTestServices(s => s.AddSingleton<TimeProvider>(Clock));
    }
}
