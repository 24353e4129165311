using System.Text;
using EventReview.Core.Notifications;

namespace EventReview.Core.Tests.Notifications;

public sealed class WebhookSignatureTests
{
    [Fact]
    public void Hmac_sha256_matches_the_rfc_4231_test_vector()
    {
        // RFC 4231, section 4.3 (test case 2): key "Jefe", data "what do ya want for nothing?".
        var mac = WebhookSignature.HmacSha256Hex(Encoding.ASCII.GetBytes("Jefe"), Encoding.ASCII.GetBytes("what do ya want for nothing?"));

        Assert.Equal("5bdcc146bf60754e6a042426089575c75a003f089d2739839dec58b964ec3843", mac);
    }

    [Fact]
    public void The_header_signs_the_timestamp_a_full_stop_and_the_body()
    {
        // Reference computed with Python 3's hmac module:
        // hmac.new(b'whsec_0123456789abcdef', b'1767225600.{"event":"item.assigned","subject":"x"}', hashlib.sha256).hexdigest()
        const string body = """{"event":"item.assigned","subject":"x"}""";

        var header = WebhookSignature.Sign("whsec_0123456789abcdef", 1_767_225_600, body);

        Assert.Equal("sha256=f62e5e433a3cff95c4e4f424f511bf3086631de848c13ec1255ca59453af4c2d", header);
    }

    [Fact]
    public void A_receiver_accepts_the_signed_request_and_refuses_a_changed_body_an_old_timestamp_or_another_secret()
    {
        var now = new DateTimeOffset(2027, 3, 1, 12, 0, 0, TimeSpan.Zero);
        var t = now.ToUnixTimeSeconds();
        const string body = """{"event":"item.due"}""";
        var header = WebhookSignature.Sign("s3cret", t, body);

        Assert.True(WebhookSignature.Verify("s3cret", t.ToString(System.Globalization.CultureInfo.InvariantCulture), header, body, now.AddMinutes(4)));
        Assert.False(WebhookSignature.Verify("s3cret", t.ToString(System.Globalization.CultureInfo.InvariantCulture), header, body.Replace("due", "ok", StringComparison.Ordinal), now));
        Assert.False(WebhookSignature.Verify("other", t.ToString(System.Globalization.CultureInfo.InvariantCulture), header, body, now));

        // Replayed later: the same, correctly signed request is refused once the timestamp is older than the tolerance.
        Assert.False(WebhookSignature.Verify("s3cret", t.ToString(System.Globalization.CultureInfo.InvariantCulture), header, body, now.AddMinutes(6)));

        // A signature over the body alone (timestamp not bound) does not pass: moving the timestamp forward breaks it.
        Assert.False(WebhookSignature.Verify("s3cret", (t + 600).ToString(System.Globalization.CultureInfo.InvariantCulture), header, body, now.AddMinutes(10)));
        Assert.False(WebhookSignature.Verify("s3cret", "not-a-number", header, body, now));
    }
}
