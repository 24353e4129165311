using EventReview.Web.Tests.Fixtures;
using Microsoft.AspNetCore.Hosting;

namespace EventReview.Web.Tests.Security;

/// <summary>The app with tiny rate limits, so that tests reach them in a few requests.</summary>
public sealed class SmallLimitsFactory : EventReviewFactory
{
    public const int SignInPerMinute = 3;
    public const int TokenBurst = 3;
    public const int AddressPerMinute = 5;

    protected override void ConfigureWebHost(IWebHostBuilder builder)
    {
        base.ConfigureWebHost(builder);
        builder.UseSetting("EventReview:RateLimits:SignInPerMinute", SignInPerMinute.ToString(System.Globalization.CultureInfo.InvariantCulture));
        builder.UseSetting("EventReview:RateLimits:TokenPerSecond", "1");
        builder.UseSetting("EventReview:RateLimits:TokenBurst", TokenBurst.ToString(System.Globalization.CultureInfo.InvariantCulture));
        builder.UseSetting("EventReview:RateLimits:AddressPerMinute", AddressPerMinute.ToString(System.Globalization.CultureInfo.InvariantCulture));
    }
}
